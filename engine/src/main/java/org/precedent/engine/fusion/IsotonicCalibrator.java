package org.precedent.engine.fusion;

import java.util.Arrays;

/**
 * A non-decreasing map from score to probability given by points (thresholds[i], values[i]).
 * Between two points the value is interpolated linearly; below the first and above the last it is
 * held at the end value. {@link IsotonicCalibration} puts each pooled block's lowest and highest
 * score at the block mean, so the map is flat across a block and ramps linearly between blocks,
 * rather than jumping at an arbitrary point in the gap where no training score fell.
 *
 * @param thresholds strictly increasing finite scores, at least one
 * @param values probabilities in [0, 1], non-decreasing, one per threshold
 */
public record IsotonicCalibrator(double[] thresholds, double[] values) {
  public IsotonicCalibrator {
    Checks.finite(thresholds, "threshold");
    Checks.finite(values, "value");
    if (thresholds.length == 0 || thresholds.length != values.length) {
      throw new IllegalArgumentException("need one value per threshold and at least one; got "
          + thresholds.length + " thresholds and " + values.length + " values");
    }
    thresholds = thresholds.clone();
    values = values.clone();
    for (int i = 0; i < values.length; i++) {
      if (values[i] < 0 || values[i] > 1) {
        throw new IllegalArgumentException("value " + i + " must be a probability; got " + values[i]);
      }
      if (i > 0 && !(thresholds[i] > thresholds[i - 1])) {
        throw new IllegalArgumentException("thresholds must increase strictly; " + thresholds[i - 1]
            + " is followed by " + thresholds[i]);
      }
      if (i > 0 && values[i] < values[i - 1]) {
        throw new IllegalArgumentException("values must not decrease; " + values[i - 1]
            + " is followed by " + values[i]);
      }
    }
  }

  @Override
  public double[] thresholds() {
    return thresholds.clone();
  }

  @Override
  public double[] values() {
    return values.clone();
  }

  /** Calibrated probability for a finite score. */
  public double calibrate(double score) {
    Checks.finite(score, "score");
    int last = thresholds.length - 1;
    if (score <= thresholds[0]) {
      return values[0];
    }
    if (score >= thresholds[last]) {
      return values[last];
    }
    int found = Arrays.binarySearch(thresholds, score);
    if (found >= 0) {
      return values[found];
    }
    int upper = -found - 1;
    int lower = upper - 1;
    double fraction = (score - thresholds[lower]) / (thresholds[upper] - thresholds[lower]);
    return values[lower] + fraction * (values[upper] - values[lower]);
  }

  // A record compares arrays by identity; a calibrator is a value, so compare contents.
  @Override
  public boolean equals(Object other) {
    return other instanceof IsotonicCalibrator c
        && Arrays.equals(thresholds, c.thresholds)
        && Arrays.equals(values, c.values);
  }

  @Override
  public int hashCode() {
    return 31 * Arrays.hashCode(thresholds) + Arrays.hashCode(values);
  }

  @Override
  public String toString() {
    return "IsotonicCalibrator[thresholds=" + Arrays.toString(thresholds) + ", values="
        + Arrays.toString(values) + "]";
  }
}
