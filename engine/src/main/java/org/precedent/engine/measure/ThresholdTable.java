package org.precedent.engine.measure;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * The table a manager reads before choosing a reply threshold: for each candidate, how much is
 * answered automatically, how often those replies are right (with an interval, since a held-out set
 * is small), and how many wrong replies customers would receive per 1,000 tickets.
 */
public final class ThresholdTable {
  private ThresholdTable() {}

  /** One row per threshold, in the order given. */
  public static List<ThresholdRow> rows(List<JudgedAnswer> answers, List<Double> thresholds) {
    return rows(Inputs.nonEmpty(answers, "threshold table"), 0, thresholds);
  }

  /**
   * One row per threshold, in the order given, when {@code neverAnswered} further tickets go to a
   * person whatever their confidence: they count among the tickets, never among the answered.
   */
  public static List<ThresholdRow> rows(List<JudgedAnswer> answers, int neverAnswered,
      List<Double> thresholds) {
    List<JudgedAnswer> all = List.copyOf(answers);
    if (neverAnswered < 0 || all.size() + neverAnswered == 0) {
      throw new IllegalArgumentException("threshold table needs at least one ticket; got "
          + all.size() + " answerable and " + neverAnswered + " never answered");
    }
    List<Double> candidates = Inputs.nonEmpty(thresholds, "threshold table (thresholds)");
    int n = all.size() + neverAnswered;
    List<ThresholdRow> rows = new ArrayList<>(candidates.size());
    for (Double t : candidates) {
      double threshold = Inputs.closed01(Objects.requireNonNull(t, "threshold is null"), "threshold");
      int answered = 0;
      int right = 0;
      for (JudgedAnswer a : all) {
        if (a.confidence() >= threshold) {
          answered++;
          if (a.correct()) {
            right++;
          }
        }
      }
      rows.add(row(threshold, answered, right, n));
    }
    return List.copyOf(rows);
  }

  private static ThresholdRow row(double threshold, int answered, int right, int total) {
    // Wrong per 1,000 = 1,000 x share answered x (1 - precision) = 1,000 x wrong / total.
    double wrongPerThousand = 1000.0 * (answered - right) / total;
    if (answered == 0) {
      return new ThresholdRow(threshold, 0, 0.0, Double.NaN, Double.NaN, Double.NaN, wrongPerThousand);
    }
    Interval wilson = Proportions.wilson(right, answered, Proportions.Z_95);
    return new ThresholdRow(threshold, answered, (double) answered / total, (double) right / answered,
        wilson.lower(), wilson.upper(), wrongPerThousand);
  }
}
