package org.precedent.engine.decide;

import java.util.function.Supplier;
import org.precedent.engine.candidates.Bm25Candidates;
import org.precedent.engine.candidates.CandidateStages;
import org.precedent.engine.candidates.HybridCandidates;
import org.precedent.engine.candidates.RerankerScores;
import org.precedent.engine.dense.DenseLeg;
import org.precedent.engine.fusion.FusionModel;
import org.precedent.engine.fusion.Ranker;
import org.precedent.engine.rerank.Scorer;
import org.precedent.engine.safety.SafetyPolicy;
import org.precedent.knowledge.retrieve.Retriever;

/**
 * The one place where the stages are put together: the service, {@code ask}, {@code triage},
 * {@code evaluate}, the benchmarks and the fitting of fusion all decide through what is made here.
 * A new candidate source or scorer is one class, and one line here.
 */
public final class Assembly {
  private Assembly() {}

  /** Stages one and two over the knowledge's index and a reranker, BM25 only. */
  public static CandidateStages candidates(Retriever retriever, Scorer reranker) {
    return candidates(retriever, reranker, null);
  }

  /**
   * Stages one and two over the knowledge's index and a reranker: what fusion is fitted on.
   *
   * @param dense the dense leg, or null for BM25 only
   */
  public static CandidateStages candidates(Retriever retriever, Scorer reranker, DenseLeg dense) {
    return candidates(retriever, () -> reranker, dense);
  }

  /** As {@link #candidates(Retriever, Scorer, DenseLeg)}, the reranker asked for when needed. */
  static CandidateStages candidates(Retriever retriever, Supplier<Scorer> reranker,
      DenseLeg dense) {
    if (reranker == null) {
      reranker = () -> {
        throw new IllegalStateException("this model version holds no reranker");
      };
    }
    if (dense == null) {
      return new CandidateStages(new Bm25Candidates(retriever), new RerankerScores(reranker));
    }
    return new CandidateStages(new HybridCandidates(retriever, dense.encoder()),
        new RerankerScores(reranker), dense::probabilities);
  }

  /**
   * Stages one and two without a reranker (a version trained without one): asking them for the
   * reranker's scores is an error.
   */
  public static CandidateStages candidatesWithoutReranker(Retriever retriever, DenseLeg dense) {
    return candidates(retriever, (Supplier<Scorer>) null, dense);
  }

  /** Every stage, BM25 only, with a fitted fusion model, a safety policy and the thresholds. */
  public static Pipeline pipeline(Retriever retriever, Scorer reranker, FusionModel fusion,
      SafetyPolicy safety, Thresholds thresholds) {
    return pipeline(retriever, reranker, null, fusion, safety, thresholds,
        RerankerUse.fromSetting());
  }

  /**
   * Every stage, with a fitted fusion model, a safety policy and the thresholds in force.
   *
   * @param dense       the dense leg, or null for BM25 only; present exactly when fusion learnt
   *                    from it
   * @param rerankerUse when decisions run the reranker
   */
  public static Pipeline pipeline(Retriever retriever, Scorer reranker, DenseLeg dense,
      FusionModel fusion, SafetyPolicy safety, Thresholds thresholds, RerankerUse rerankerUse) {
    return pipeline(retriever, () -> reranker, dense, fusion, safety, thresholds, rerankerUse);
  }

  /** As above, the reranker asked for only when a decision needs it. */
  static Pipeline pipeline(Retriever retriever, Supplier<Scorer> reranker, DenseLeg dense,
      FusionModel fusion, SafetyPolicy safety, Thresholds thresholds, RerankerUse rerankerUse) {
    if (fusion.reranker() && reranker == null) {
      throw new IllegalArgumentException("the fusion model learnt from the reranker, so "
          + "decisions need it");
    }
    if (fusion.dense() != (dense != null)) {
      throw new IllegalArgumentException(fusion.dense()
          ? "the fusion model learnt from the dense leg, so decisions need it"
          : "the fusion model learnt without the dense leg, so decisions must not use it");
    }
    return new Pipeline(candidates(retriever, reranker, dense), new Ranker(fusion), safety,
        thresholds, rerankerUse);
  }
}
