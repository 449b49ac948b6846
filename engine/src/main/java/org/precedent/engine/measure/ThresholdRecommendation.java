package org.precedent.engine.measure;

import java.util.Locale;
import java.util.Objects;

/**
 * A reply threshold together with the evidence that backs it.
 *
 * @param status              whether a threshold could be certified, and if not, why
 * @param threshold           reply automatically when confidence >= this; positive infinity (reply to
 *                            nothing automatically) unless the status is {@link Status#OK}
 * @param coverage            share of held-out tickets the threshold answers; 0 unless OK
 * @param empiricalPrecision  share of those answers that were right; NaN unless OK
 * @param precisionLowerBound one-sided Clopper-Pearson lower bound on precision at the corrected
 *                            delta; NaN unless OK
 * @param sampleSize          how many held-out answers were used
 * @param thresholdsTried     how many thresholds the search evaluated
 * @param targetPrecision     the precision the bound had to reach
 * @param correctedDelta      delta divided by ceil(log2 n), the Bonferroni share of each tried threshold
 * @param minimalSampleNeeded the fewest accepted answers that, all right, could certify the target at
 *                            the corrected delta: the smallest m with correctedDelta^(1/m) >= target
 */
public record ThresholdRecommendation(
    Status status,
    double threshold,
    double coverage,
    double empiricalPrecision,
    double precisionLowerBound,
    int sampleSize,
    int thresholdsTried,
    double targetPrecision,
    double correctedDelta,
    int minimalSampleNeeded) {

  /** Outcome of the search. */
  public enum Status {
    /** A threshold was certified. */
    OK,
    /** Too few held-out answers: even if all were right, the bound could not reach the target. */
    TOO_FEW,
    /** Enough answers in principle, but no tried threshold kept the bound at the target. */
    NOT_CERTIFIED
  }

  public ThresholdRecommendation {
    Objects.requireNonNull(status, "status");
    if (sampleSize < 1 || thresholdsTried < 1 || minimalSampleNeeded < 1) {
      throw new IllegalArgumentException("sample size, thresholds tried and minimal sample must be positive");
    }
    Inputs.open01(targetPrecision, "target precision");
    Inputs.open01(correctedDelta, "corrected delta");
    if (status == Status.OK) {
      Inputs.closed01(threshold, "threshold");
      Inputs.closed01(coverage, "coverage");
      Inputs.closed01(empiricalPrecision, "empirical precision");
      if (!(precisionLowerBound >= targetPrecision && precisionLowerBound <= empiricalPrecision)) {
        throw new IllegalArgumentException("a certified threshold needs target <= lower bound <= precision");
      }
    } else if (threshold != Double.POSITIVE_INFINITY || coverage != 0.0
        || !Double.isNaN(empiricalPrecision) || !Double.isNaN(precisionLowerBound)) {
      throw new IllegalArgumentException("without a certified threshold nothing is answered automatically");
    }
  }

  /** Whether any ticket should be answered without a human. */
  public boolean repliesAutomatically() {
    return status == Status.OK;
  }

  /** The recommendation in plain words, for the person who sets the threshold. */
  public String explanation() {
    String target = percent(targetPrecision);
    switch (status) {
      case OK:
        return String.format(Locale.ROOT,
            "Reply automatically at confidence >= %s: covers %s of tickets, %s right on held-out data; "
                + "with probability at least %s the true precision is at least %s (lower bound %s).",
            ThresholdDecimals.of(threshold), percent(coverage), percent(empiricalPrecision), percent(1 - overallDelta()),
            target, percent(precisionLowerBound));
      case TOO_FEW:
        return String.format(Locale.ROOT,
            "Hand every ticket to a person. %d held-out answers cannot certify %s precision even if "
                + "every one were right; at least %d right answers above the threshold are needed.",
            sampleSize, target, minimalSampleNeeded);
      default:
        return String.format(Locale.ROOT,
            "Hand every ticket to a person. No threshold tried on %d held-out answers keeps %s precision "
                + "with the required confidence; the most confident answers contain too many wrong ones.",
            sampleSize, target);
    }
  }

  // Undo the Bonferroni split to state the overall confidence the caller asked for.
  private double overallDelta() {
    return correctedDelta * GuaranteedThreshold.searchSteps(sampleSize);
  }

  private static String percent(double share) {
    return String.format(Locale.ROOT, "%.1f%%", 100.0 * share);
  }
}
