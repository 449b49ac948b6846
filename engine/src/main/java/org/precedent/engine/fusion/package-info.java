/**
 * Learning pieces that turn per-candidate evidence into one calibrated confidence.
 *
 * <ul>
 *   <li>{@link org.precedent.engine.fusion.LogisticRegression} combines features of a candidate
 *       answer (retrieval and reranker scores, and the like) into log-odds that it is right; the fit is
 *       a {@link org.precedent.engine.fusion.LogisticModel} that saves as a plain map.
 *   <li>{@link org.precedent.engine.fusion.PlattScaling} (a sigmoid, two parameters) and
 *       {@link org.precedent.engine.fusion.IsotonicCalibration} (any non-decreasing step shape) map a
 *       score to a probability; Platt's is the default for small samples, isotonic is for comparison.
 *   <li>{@link org.precedent.engine.fusion.CrossFit} assigns tickets to folds so calibrators are
 *       fitted on out-of-fold scores, never on scores from a model that saw the same ticket.
 * </ul>
 *
 * <p>Inputs are checked on entry and refused with an {@link java.lang.IllegalArgumentException} that
 * names the problem (empty data, ragged rows, non-finite values, a single class for logistic
 * regression). Fitted models are immutable records. Pure JDK, deterministic, no input/output.
 */
package org.precedent.engine.fusion;
