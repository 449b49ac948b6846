/**
 * General statistics, with no knowledge of tickets or answers: logistic regression, calibration
 * and cross-fitting. It depends on the JDK only; fusion and training use it.
 *
 * <ul>
 *   <li>{@link org.precedent.engine.stats.LogisticRegression} combines features of a candidate
 *       answer (retrieval and reranker scores, and the like) into log-odds that it is right; the fit is
 *       a {@link org.precedent.engine.stats.LogisticModel}.
 *   <li>{@link org.precedent.engine.stats.PlattScaling} (a sigmoid, two parameters) maps a score
 *       to a probability.
 *   <li>{@link org.precedent.engine.stats.CrossFit} assigns tickets to folds so calibrators are
 *       fitted on out-of-fold scores, never on scores from a model that saw the same ticket.
 * </ul>
 *
 * <p>Inputs are checked on entry and refused with an {@link java.lang.IllegalArgumentException} that
 * names the problem (empty data, ragged rows, non-finite values, a single class for logistic
 * regression). Fitted models are immutable records. Pure JDK, deterministic, no input/output.
 */
package org.precedent.engine.stats;
