/**
 * The reply threshold over HTTP: {@link org.precedent.api.threshold.ThresholdController} reads the
 * global and per-category thresholds, changes them for managers all or nothing (the thresholds file,
 * the audit row and the advisor in force, through {@code ModelHolder}), lists the changes, and serves the latest evaluation report to choose a threshold by, with the
 * approval gate's effect at a threshold ({@code api.answers.ApprovalCoverage}). It depends on
 * {@code api.answers}, {@code api.system}, {@code engine.decide} (the thresholds), {@code engine.evaluate} (the report), {@code
 * engine.measure} (threshold rounding), Spring Web and Spring JDBC; nothing depends on it.
 */
package org.precedent.api.threshold;
