package org.precedent.engine.fusion;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import org.precedent.engine.candidates.CandidateScoring;
import org.precedent.engine.explain.Explanation;
import org.precedent.engine.rerank.AnswerScore;
import org.precedent.engine.stats.PlattCalibrator;
import org.precedent.knowledge.retrieve.Candidate;

/** Orders scored candidates by one system and gives its calibrated confidence. */
public final class Ranker {
  private final FusionModel fusion;

  public Ranker(FusionModel fusion) {
    this.fusion = fusion;
  }

  FusionModel fusion() {
    return fusion;
  }

  /** The systems the model has, in {@link ScoringSystem} order; the cascade when it can run. */
  public List<ScoringSystem> systems() {
    List<ScoringSystem> out = new ArrayList<>(fusion.fitted());
    if (cascades()) {
      out.add(ScoringSystem.CASCADE);
    }
    return List.copyOf(out);
  }

  /**
   * @param scoring the candidates, in retrieval order, with their scores
   * @throws IllegalArgumentException when the model has no such system, or the system needs the
   *                                  reranker's scores and the candidates lack them
   */
  public Ranked rank(ScoringSystem system, CandidateScoring scoring) {
    if (system == ScoringSystem.CASCADE) {
      if (!cascades()) {
        throw new IllegalArgumentException("the cascade needs a model with a dense leg, "
            + "fusion without the reranker and the reranker");
      }
      return rank(legsAgree(scoring) ? ScoringSystem.FUSED_WITHOUT_RERANKER : ScoringSystem.FUSED,
          scoring);
    }
    if (system.usesReranker() && !scoring.reranked()) {
      throw new IllegalArgumentException(system.label() + " needs the reranker's scores, and "
          + "the reranker did not run for this question");
    }
    List<Candidate> candidates = scoring.candidates();
    List<AnswerScore> scores = scoring.scores();
    SystemModel own = fusion.system(system);
    if (candidates.isEmpty()) {
      return new Ranked(system, List.of(), 0);
    }
    double[][] all = Features.of(scoring);
    // Each candidate's own probability comes from the fullest model the scores allow.
    SystemModel fused = fusion.system(scoring.reranked() ? ScoringSystem.FUSED : withoutReranker());
    double[][] ownRows = Features.select(all, own.features());
    List<ScoredCandidate> scored = new ArrayList<>();
    double[] ownLogit = new double[candidates.size()];
    for (int i = 0; i < candidates.size(); i++) {
      ownLogit[i] = own.model().logit(ownRows[i]);
      scored.add(new ScoredCandidate(candidates.get(i), scores == null ? null : scores.get(i),
          Arrays.stream(all[i]).boxed().toList(),
          fused.model().probability(Features.select(all[i], fused.features()))));
    }
    int[] order = order(system, ownLogit, scores);
    List<ScoredCandidate> ordered = new ArrayList<>();
    for (int i : order) {
      ordered.add(scored.get(i));
    }
    double confidence = own.calibration().calibrate(ownLogit[order[0]]);
    return new Ranked(system, ordered, confidence);
  }

  /**
   * Whether BM25, the dense leg and their fusion put the same answer first, so the cascade leaves
   * the reranker out; true when there is at most one candidate (nothing to reorder), false for a
   * model without a dense leg (there is no second leg to agree).
   */
  public boolean legsAgree(CandidateScoring scoring) {
    int n = scoring.candidates().size();
    if (n <= 1) {
      return true;
    }
    if (!cascades()) {
      return false;
    }
    double[][] all = Features.of(scoring);
    // BM25's first is the first candidate: the source lists BM25's in its order, then the rest.
    return best(ScoringSystem.DENSE, all) == 0
        && best(ScoringSystem.FUSED_WITHOUT_RERANKER, all) == 0;
  }

  /** The index of the candidate a system without the reranker's features puts first. */
  private int best(ScoringSystem system, double[][] all) {
    SystemModel model = fusion.system(system);
    double[][] rows = Features.select(all, model.features());
    double[] logits = new double[rows.length];
    for (int i = 0; i < rows.length; i++) {
      logits[i] = model.model().logit(rows[i]);
    }
    return order(system, logits, null)[0];
  }

  /** Whether the model has the two systems the cascade chooses between by the legs' agreement. */
  private boolean cascades() {
    return fusion.has(ScoringSystem.DENSE) && fusion.has(ScoringSystem.FUSED_WITHOUT_RERANKER)
        && fusion.has(ScoringSystem.FUSED);
  }

  /** Whether the model learnt from the reranker: a version without one never runs it. */
  public boolean hasReranker() {
    return fusion.reranker();
  }

  /** The fused system without the reranker, or BM25's in a model trained before it existed. */
  private ScoringSystem withoutReranker() {
    return fusion.has(ScoringSystem.FUSED_WITHOUT_RERANKER)
        ? ScoringSystem.FUSED_WITHOUT_RERANKER : ScoringSystem.BM25;
  }

  /**
   * Why the first candidate has the confidence it has: the Platt calibration of the system's logit,
   * and the logit as the bias plus one term per feature (in standardised units, so that terms
   * compare), largest effect first.
   */
  public Explanation explain(Ranked ranked) {
    if (ranked.candidates().isEmpty()) {
      return Explanation.of("confidence", 0, "no candidate, so nothing to be confident in");
    }
    SystemModel own = fusion.system(ranked.system());
    double[] all = ranked.candidates().get(0).features().stream().mapToDouble(Double::doubleValue)
        .toArray();
    double[] x = Features.select(new double[][] {all}, own.features())[0];
    double[] terms = own.model().terms(x);
    List<Explanation> parts = new ArrayList<>();
    parts.add(Explanation.of("bias", own.model().bias(), "log-odds at the average candidate"));
    for (int j = 0; j < x.length; j++) {
      parts.add(Explanation.of(own.features().get(j), terms[j],
          String.format(Locale.ROOT, "%s = %.4g", own.features().get(j), x[j])));
    }
    Explanation logit = Explanation.sum("logit", ranked.system().label()
        + " logit: the bias plus one term per feature", parts);
    PlattCalibrator platt = own.calibration();
    return new Explanation("confidence", ranked.confidence(), String.format(Locale.ROOT,
        "Platt calibration of the logit: 1 / (1 + exp(%.3f * logit %+.3f))", platt.a(), platt.b()),
        List.of(logit));
  }

  /**
   * Candidate indexes in a system's order: BM25 keeps BM25's order, the reranker sorts by its
   * anti-LM score, the dense leg and fusion by their logits; ties keep retrieval's order.
   */
  public static int[] order(ScoringSystem system, double[] logits, List<AnswerScore> scores) {
    Integer[] order = new Integer[logits.length];
    for (int i = 0; i < order.length; i++) {
      order[i] = i;
    }
    Comparator<Integer> by = switch (system) {
      case BM25 -> Comparator.comparingInt(i -> i);
      case RERANKER -> Comparator.comparingDouble(i -> -scores.get(i).antiLm());
      case DENSE, FUSED_WITHOUT_RERANKER, FUSED, CASCADE ->
          Comparator.comparingDouble(i -> -logits[i]);
    };
    Arrays.sort(order, by.thenComparingInt(i -> i));
    return Arrays.stream(order).mapToInt(Integer::intValue).toArray();
  }

  /** The rows of a system's features, one per candidate. */
  static double[][] features(SystemModel system, CandidateScoring scoring) {
    return Features.select(Features.of(scoring), system.features());
  }

  /** The rows of the features named, one per candidate. */
  static double[][] features(List<String> names, CandidateScoring scoring) {
    return Features.select(Features.of(scoring), names);
  }
}
