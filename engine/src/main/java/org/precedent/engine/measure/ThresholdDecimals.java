package org.precedent.engine.measure;

import java.math.BigDecimal;
import java.math.RoundingMode;

/**
 * Thresholds written with the digits they have, and confidences written so that they compare with
 * a threshold the way the numbers do.
 *
 * <p>A threshold of 0.996 written as "1.00" states a rule that is not in force, and a confidence of
 * 0.9955 written as "1.00" next to it reads as "above the threshold" while it is below. So a
 * threshold is written exactly (the shortest decimal that reads back as the same double, as
 * {@link Double#toString} gives it), and a confidence is cut, never rounded up, to the threshold's
 * number of decimals: then the written confidence is below the written threshold exactly when the
 * confidence is below the threshold.
 */
public final class ThresholdDecimals {
  /** Decimals shown at least, so that 0.9 and 0.95 line up as 0.90 and 0.95. */
  public static final int SHOWN = 2;
  /** How far below an observed confidence the threshold that names it may lie, at most. */
  public static final double NAMED_WITHIN = 0.001;

  private ThresholdDecimals() {}

  /** The threshold with all of its digits and at least {@code minDecimals} decimals. */
  public static String of(double threshold, int minDecimals) {
    if (Double.isNaN(threshold) || Double.isInfinite(threshold)) {
      return Double.toString(threshold);
    }
    return exact(threshold, minDecimals).toPlainString();
  }

  /** {@link #of(double, int)} with {@value #SHOWN} decimals at least. */
  public static String of(double threshold) {
    return of(threshold, SHOWN);
  }

  /**
   * The confidence cut to as many decimals as {@link #of(double)} gives the threshold, so that
   * {@code confidence < threshold} exactly when the written confidence is below the written
   * threshold: both the shortest decimal of a double and cutting to fixed decimals keep the order
   * of numbers, and the written threshold is exact at that many decimals.
   */
  public static String confidence(double confidence, double threshold) {
    if (Double.isNaN(confidence) || Double.isInfinite(confidence)) {
      return Double.toString(confidence);
    }
    int decimals = Double.isNaN(threshold) || Double.isInfinite(threshold) ? SHOWN
        : exact(threshold, SHOWN).scale();
    return BigDecimal.valueOf(confidence).setScale(decimals, RoundingMode.FLOOR).toPlainString();
  }

  /**
   * The shortest decimal number t with {@code low < t <= high}, as a double (high itself when no
   * shorter one is found). Every threshold in that range replies to the same answers as
   * {@code high} when no answer's confidence lies strictly between {@code low} and {@code high}.
   */
  public static double shortestAbove(double low, double high) {
    if (!(low < high) || Double.isInfinite(high)) {
      return high;
    }
    BigDecimal from = new BigDecimal(low);
    BigDecimal to = new BigDecimal(high);
    for (int decimals = 0; decimals <= 17; decimals++) {
      BigDecimal step = BigDecimal.ONE.movePointLeft(decimals);
      BigDecimal candidate = from.setScale(decimals, RoundingMode.FLOOR).add(step);
      double t = candidate.doubleValue();
      // The double nearest to the decimal must itself still lie in the range.
      if (candidate.compareTo(to) <= 0 && t > low && t <= high) {
        return t;
      }
    }
    return high;
  }

  /**
   * The threshold that names "reply at this observed confidence and above": the shortest decimal
   * above the next lower observed confidence, and at most {@value #NAMED_WITHIN} below this one.
   * It replies to exactly the same observed answers, so every figure measured at the confidence
   * holds for it, and a reader sees 0.996 rather than 0.99604178.
   *
   * @param nextLower the next lower observed confidence, or negative infinity when there is none
   */
  public static double naming(double confidence, double nextLower) {
    return shortestAbove(Math.max(nextLower, confidence - NAMED_WITHIN), confidence);
  }

  private static BigDecimal exact(double value, int minDecimals) {
    BigDecimal shortest = BigDecimal.valueOf(value).stripTrailingZeros();
    return shortest.scale() < minDecimals ? shortest.setScale(minDecimals) : shortest;
  }
}
