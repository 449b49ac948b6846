package org.precedent.engine.measure;

import java.util.List;

/**
 * How well the ranked list of past answers puts the right one near the top.
 *
 * <p>All three measures treat a ticket whose right answer is absent from the list as a miss, so a
 * retrieval step that drops answers cannot look better by shrinking the denominator.
 */
public final class Ranking {
  private Ranking() {}

  /** Share of tickets whose right answer is ranked first. */
  public static double top1Accuracy(List<RankedOutcome> outcomes) {
    return recallAt(outcomes, 1);
  }

  /**
   * Mean reciprocal rank: the mean over tickets of 1/rank, with 0 for a ticket whose right answer is
   * absent (the reading used in the TREC question-answering evaluations).
   */
  public static double meanReciprocalRank(List<RankedOutcome> outcomes) {
    List<RankedOutcome> all = Inputs.nonEmpty(outcomes, "mean reciprocal rank");
    double sum = 0.0;
    for (RankedOutcome o : all) {
      if (o.found()) {
        sum += 1.0 / o.rankOfRightAnswer();
      }
    }
    return sum / all.size();
  }

  /** Share of tickets whose right answer is within the first {@code k} proposals. */
  public static double recallAt(List<RankedOutcome> outcomes, int k) {
    if (k < 1) {
      throw new IllegalArgumentException("recall@k needs k >= 1; got " + k);
    }
    List<RankedOutcome> all = Inputs.nonEmpty(outcomes, "recall@" + k);
    int hits = 0;
    for (RankedOutcome o : all) {
      if (o.found() && o.rankOfRightAnswer() <= k) {
        hits++;
      }
    }
    return (double) hits / all.size();
  }
}
