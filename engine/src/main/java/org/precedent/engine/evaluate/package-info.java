/**
 * The evaluation report: how candidate systems did on held-out tickets, and which reply threshold
 * each can safely use.
 *
 * <p>{@link org.precedent.engine.evaluate.EvaluationReports} turns {@link
 * org.precedent.engine.evaluate.SystemRun}s into an immutable {@link
 * org.precedent.engine.evaluate.EvaluationReport}. Every number comes from {@code
 * org.precedent.engine.measure}; this package only decides which tickets each measure sees (ranking:
 * in-scope tickets; confidence and thresholds: all tickets, since a reply to an out-of-scope ticket
 * is a wrong reply) and arranges the results. {@link org.precedent.engine.evaluate.ReportFiles}
 * writes and reads the report as JSON, and writes HTML, each atomically. {@link
 * org.precedent.engine.evaluate.HtmlReport} renders one self-contained page, optionally with the
 * changes since an earlier report.
 *
 * <p>All text taken from data is HTML-escaped before it reaches the page.
 *
 * <p>{@link org.precedent.engine.evaluate.HeldOutRuns} asks the held-out questions of each system,
 * through the same candidate scoring, ranking and safety gate as a decision. The package depends on
 * {@code engine.measure}, {@code engine.decide}, {@code engine.rerank}, {@code engine.safety}, {@code
 * knowledge.retrieve}, {@code knowledge.io} and Jackson; the figures, the command line and the
 * service's threshold page depend on it.
 */
package org.precedent.engine.evaluate;
