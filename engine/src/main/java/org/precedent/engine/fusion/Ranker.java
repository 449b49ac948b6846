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

  /** The systems the model has, in {@link ScoringSystem} order. */
  public List<ScoringSystem> systems() {
    return fusion.fitted();
  }

  /**
   * @param scoring the candidates, in retrieval order, with their scores
   * @throws IllegalArgumentException when the model has no such system
   */
  public Ranked rank(ScoringSystem system, CandidateScoring scoring) {
    List<Candidate> candidates = scoring.candidates();
    List<AnswerScore> scores = scoring.scores();
    SystemModel own = fusion.system(system);
    if (candidates.isEmpty()) {
      return new Ranked(system, List.of(), 0);
    }
    double[][] all = Features.of(scoring);
    SystemModel fused = fusion.system(ScoringSystem.FUSED);
    double[][] ownRows = Features.select(all, own.features());
    List<ScoredCandidate> scored = new ArrayList<>();
    double[] ownLogit = new double[candidates.size()];
    for (int i = 0; i < candidates.size(); i++) {
      ownLogit[i] = own.model().logit(ownRows[i]);
      scored.add(new ScoredCandidate(candidates.get(i), scores.get(i),
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
      case DENSE, FUSED_WITHOUT_RERANKER, FUSED -> Comparator.comparingDouble(i -> -logits[i]);
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
