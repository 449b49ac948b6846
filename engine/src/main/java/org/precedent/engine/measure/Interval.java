package org.precedent.engine.measure;

/**
 * A confidence interval for a proportion.
 *
 * @param lower lower limit in [0, 1]
 * @param upper upper limit in [lower, 1]
 */
public record Interval(double lower, double upper) {
  public Interval {
    Inputs.closed01(lower, "interval lower limit");
    Inputs.closed01(upper, "interval upper limit");
    if (lower > upper) {
      throw new IllegalArgumentException("interval lower limit " + lower + " exceeds upper limit " + upper);
    }
  }

  /** Whether {@code value} lies within the interval, ends included. */
  public boolean contains(double value) {
    return value >= lower && value <= upper;
  }
}
