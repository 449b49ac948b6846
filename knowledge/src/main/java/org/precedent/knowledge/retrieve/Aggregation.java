package org.precedent.knowledge.retrieve;

import java.util.List;

/**
 * How the BM25 scores of a group's retrieved tickets become the group's score.
 *
 * <p>{@link #MAX_PLUS_SUPPORT} is the default: the best ticket's score, plus a small share of the
 * next two. The best match carries the decision (as CombMAX in Fox and Shaw 1994, "Combination of
 * Multiple Searches"); the share of the runners-up breaks near-ties in favour of answers that several
 * similar past questions received. DEVELOPERS.md gives the recall it was chosen on.
 */
public enum Aggregation {
  /** The best ticket's score alone (CombMAX). */
  MAX,
  /** The sum of all retrieved tickets' scores (CombSUM). */
  SUM,
  /** The best score plus 0.1 times each of the next two. */
  MAX_PLUS_SUPPORT;

  /** The group score from its tickets' scores, sorted best first. */
  double combine(List<Double> scoresBestFirst) {
    return switch (this) {
      case MAX -> scoresBestFirst.get(0);
      case SUM -> scoresBestFirst.stream().mapToDouble(Double::doubleValue).sum();
      case MAX_PLUS_SUPPORT -> {
        double s = scoresBestFirst.get(0);
        for (int i = 1; i < Math.min(3, scoresBestFirst.size()); i++) {
          s += 0.1 * scoresBestFirst.get(i);
        }
        yield s;
      }
    };
  }
}
