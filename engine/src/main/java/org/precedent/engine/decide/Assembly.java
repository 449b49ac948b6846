package org.precedent.engine.decide;

import org.precedent.engine.candidates.Bm25Candidates;
import org.precedent.engine.candidates.CandidateStages;
import org.precedent.engine.candidates.RerankerScores;
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

  /** Stages one and two over the knowledge's index and a reranker: what fusion is fitted on. */
  public static CandidateStages candidates(Retriever retriever, Scorer reranker) {
    return new CandidateStages(new Bm25Candidates(retriever), new RerankerScores(reranker));
  }

  /** Every stage, with a fitted fusion model, a safety policy and the thresholds in force. */
  public static Pipeline pipeline(Retriever retriever, Scorer reranker, FusionModel fusion,
      SafetyPolicy safety, Thresholds thresholds) {
    return new Pipeline(candidates(retriever, reranker), new Ranker(fusion), safety, thresholds);
  }
}
