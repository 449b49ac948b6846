/**
 * Measures of how good Precedent's proposals and confidences are, and the evidence behind a reply
 * threshold.
 *
 * <p>Four questions, one class each:
 *
 * <ul>
 *   <li>{@link org.precedent.engine.measure.Ranking}: is the right past answer near the top?
 *   <li>{@link org.precedent.engine.measure.Calibration}: does a confidence of 0.8 mean right 8 times
 *       in 10? {@link org.precedent.engine.measure.Discrimination}: do right answers score above wrong
 *       ones?
 *   <li>{@link org.precedent.engine.measure.SelectivePrediction} and
 *       {@link org.precedent.engine.measure.ThresholdTable}: what does each threshold trade, coverage
 *       against mistakes?
 *   <li>{@link org.precedent.engine.measure.GuaranteedThreshold}: which threshold keeps precision at a
 *       target with stated confidence, or why none can? Built on the bounds in
 *       {@link org.precedent.engine.measure.Proportions}.
 * </ul>
 *
 * <p>Inputs are immutable records validated on construction: a confidence must be a number in
 * [0, 1], and an empty input is refused with an {@link java.lang.IllegalArgumentException} naming the
 * measure, because a measure of nothing would be a misleading 0 or NaN in a report. An answer given to
 * an out-of-scope ticket is passed as wrong. Where a value is undefined (AUROC with only right or only
 * wrong answers, precision when nothing is answered) the result is NaN and the method says so.
 *
 * <p>Depends on the JDK and Apache Commons Statistics (the beta distribution behind the
 * Clopper-Pearson bound) only, no other Precedent package; no state, no threads, no input/output.
 */
package org.precedent.engine.measure;
