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
 * <p>{@link org.precedent.engine.evaluate.HeldOutRuns} asks the held-out questions of each system
 * through the pipeline a decision uses (its candidates, ranking and gate); {@link
 * org.precedent.engine.evaluate.HeldOutEvaluation} labels held-out tickets with their truth, runs
 * them and writes the reports where the data directory says; {@link
 * org.precedent.engine.evaluate.ClincEvaluation} runs the open CLINC150 benchmark the same way,
 * training on its train split. {@link org.precedent.engine.evaluate.VersionComparison} sets a
 * candidate model version beside the version in force on the same held-out tickets, and {@link
 * org.precedent.engine.evaluate.VersionComparisons} keeps it, checksummed, in the candidate's
 * directory; a report keeps the fused system's answer per ticket ({@link
 * org.precedent.engine.evaluate.HeldOutOutcome}) for the approval gate's figures. The package
 * depends on {@code engine.rerank} (the model store), {@code engine.measure}, {@code engine.decide},
 * {@code engine.learn}, {@code knowledge.datasets}, {@code engine.candidates}, {@code engine.fusion}, {@code
 * knowledge.ingest}, {@code knowledge.group}, {@code knowledge.store}, {@code knowledge.io} and
 * Jackson; the figures, the command line and the service's threshold page depend on it.
 */
package org.precedent.engine.evaluate;
