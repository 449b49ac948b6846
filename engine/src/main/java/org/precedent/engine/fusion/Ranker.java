package org.precedent.engine.fusion;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import org.precedent.engine.rerank.AnswerScore;
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

  /**
   * @param candidates BM25 candidates, in BM25 order
   * @param scores     the reranker's scores of their canonical answers, same order
   */
  public Ranked rank(ScoringSystem system, List<Candidate> candidates, List<AnswerScore> scores) {
    if (candidates.isEmpty()) {
      return new Ranked(system, List.of(), 0);
    }
    double[][] all = Features.of(candidates, scores);
    SystemModel fused = fusion.system(ScoringSystem.FUSED);
    SystemModel own = fusion.system(system);
    double[][] ownRows = Features.select(all, own.features());
    List<ScoredCandidate> scored = new ArrayList<>();
    double[] ownLogit = new double[candidates.size()];
    for (int i = 0; i < candidates.size(); i++) {
      ownLogit[i] = own.model().logit(ownRows[i]);
      scored.add(new ScoredCandidate(candidates.get(i), scores.get(i),
          Arrays.stream(all[i]).boxed().toList(), fused.model().probability(all[i])));
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
   * Candidate indexes in a system's order: BM25 keeps BM25's order, the reranker sorts by its
   * anti-LM score, fusion by its logit; ties keep BM25's order.
   */
  public static int[] order(ScoringSystem system, double[] logits, List<AnswerScore> scores) {
    Integer[] order = new Integer[logits.length];
    for (int i = 0; i < order.length; i++) {
      order[i] = i;
    }
    Comparator<Integer> by = switch (system) {
      case BM25 -> Comparator.comparingInt(i -> i);
      case RERANKER -> Comparator.comparingDouble(i -> -scores.get(i).antiLm());
      case FUSED -> Comparator.comparingDouble(i -> -logits[i]);
    };
    Arrays.sort(order, by.thenComparingInt(i -> i));
    return Arrays.stream(order).mapToInt(Integer::intValue).toArray();
  }

  /** The rows of a system's features, one per candidate. */
  public static double[][] features(ScoringSystem system, List<Candidate> candidates,
      List<AnswerScore> scores) {
    return Features.select(Features.of(candidates, scores), system.features());
  }
}
