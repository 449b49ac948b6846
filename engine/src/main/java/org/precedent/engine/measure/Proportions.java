package org.precedent.engine.measure;

import org.apache.commons.statistics.distribution.BetaDistribution;

/**
 * Intervals and bounds for a proportion measured on a sample, such as the precision of automatic
 * replies on held-out tickets. A point estimate alone hides how few tickets it may rest on.
 */
public final class Proportions {
  /** Two-sided 95% standard normal quantile, z = Phi^-1(0.975). */
  public static final double Z_95 = 1.959963984540054;

  private Proportions() {}

  /**
   * Wilson (1927) score interval without continuity correction. Chosen over the textbook
   * p +- z*sqrt(p(1-p)/n) because that one collapses to zero width at 0 or n successes, which is
   * exactly where a small, all-correct sample of automatic replies sits.
   *
   * @param z normal quantile for the wanted level, e.g. {@link #Z_95}
   */
  public static Interval wilson(int successes, int trials, double z) {
    checkCounts(successes, trials);
    if (!(z > 0.0) || Double.isInfinite(z)) {
      throw new IllegalArgumentException("z must be a positive finite quantile; got " + z);
    }
    double n = trials;
    double p = successes / n;
    double z2 = z * z;
    double centre = p + z2 / (2 * n);
    double halfWidth = z * Math.sqrt(p * (1 - p) / n + z2 / (4 * n * n));
    double denominator = 1 + z2 / n;
    double lower = Math.max(0.0, (centre - halfWidth) / denominator);
    double upper = Math.min(1.0, (centre + halfWidth) / denominator);
    return new Interval(lower, upper);
  }

  /**
   * Clopper-Pearson exact one-sided lower confidence bound at level 1 - alpha: the p at which seeing
   * {@code successes} or more has probability exactly alpha. That tail is the regularized incomplete
   * beta I_p(successes, trials - successes + 1), so the bound is the alpha quantile of
   * Beta(successes, trials - successes + 1), taken from Apache Commons Statistics rather than
   * written here. Exact (never anti-conservative), which matters when the bound gates replies sent
   * without a human.
   *
   * @return 0 when there are no successes; alpha^(1/trials) when all trials succeeded
   */
  public static double clopperPearsonLower(int successes, int trials, double alpha) {
    checkCounts(successes, trials);
    Inputs.open01(alpha, "alpha");
    if (successes == 0) {
      return 0.0;
    }
    return BetaDistribution.of(successes, trials - successes + 1.0).inverseCumulativeProbability(alpha);
  }

  private static void checkCounts(int successes, int trials) {
    if (trials < 1) {
      throw new IllegalArgumentException("a proportion needs at least one trial; got " + trials);
    }
    if (successes < 0 || successes > trials) {
      throw new IllegalArgumentException("successes " + successes + " is not within 0.." + trials);
    }
  }
}
