package org.precedent.engine.evaluate;

import org.precedent.engine.measure.ThresholdRow;

/**
 * What the service would have done at one threshold: the safety gate first, then the threshold.
 * A ticket the gate hands off is never answered automatically, however confident the model is.
 *
 * @param threshold        reply automatically when confidence >= this value
 * @param answered         tickets that would have been answered automatically
 * @param answeredShare    answered / all tickets
 * @param precision        share of those replies that were right; NaN when nothing was answered
 * @param precisionLower   lower limit of the 95% Wilson interval; NaN when nothing was answered
 * @param precisionUpper   upper limit of that interval; NaN when nothing was answered
 * @param wrongPerThousand wrong automatic replies per 1,000 tickets
 * @param safetyHandOffs   tickets the gate handed to a person although their confidence reached
 *                         the threshold: the confidence alone would have answered them
 */
public record ServiceRow(double threshold, int answered, double answeredShare, double precision,
    double precisionLower, double precisionUpper, double wrongPerThousand, int safetyHandOffs) {
  public ServiceRow {
    if (safetyHandOffs < 0) {
      throw new IllegalArgumentException("safety hand-offs are negative: " + safetyHandOffs);
    }
  }

  static ServiceRow of(ThresholdRow row, int safetyHandOffs) {
    return new ServiceRow(row.threshold(), row.answered(), row.answeredShare(), row.precision(),
        row.precisionLower(), row.precisionUpper(), row.wrongPerThousand(), safetyHandOffs);
  }
}
