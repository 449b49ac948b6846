package org.precedent.api.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.util.List;
import java.util.Locale;
import org.precedent.api.answers.ApprovalCoverage;
import org.precedent.api.answers.StoredAnswer;
import org.precedent.api.system.ServiceDatabase;
import org.precedent.api.threshold.ThresholdAudit;
import org.precedent.engine.decide.Thresholds;
import org.precedent.engine.evaluate.EvaluationReport;
import org.precedent.engine.evaluate.HeldOutEvaluation;
import org.precedent.engine.evaluate.SystemReport;
import org.precedent.engine.measure.ThresholdDecimals;
import org.precedent.knowledge.store.DataDir;

/**
 * A held-out evaluation as {@code evaluate} and the demo show it, and the step both take to put its
 * guaranteed threshold in force through the threshold audit.
 */
final class EvaluationPrinter {
  /** Answers listed whose approval would add coverage, most held-out tickets first. */
  private static final int LISTED = 15;

  private EvaluationPrinter() {}

  /**
   * Puts the fused system's guaranteed threshold in force, when there is one, keeping the
   * per-category thresholds in force; recorded in the database the service on {@code dataDir}
   * with {@code settings} would use.
   */
  static void applyThreshold(PrintWriter w, DataDir dataDir, List<String> settings,
      HeldOutEvaluation result, String reason) throws IOException {
    var threshold = result.guaranteedThreshold();
    if (threshold.isPresent()) {
      ServiceDatabase db = ServiceDatabase.of(dataDir.root(), settings);
      ThresholdAudit.applyFromCommandLine(dataDir, db, old -> new Thresholds(
          threshold.getAsDouble(), old.perCategory()), System.getProperty("user.name")
          + " (command line)", reason);
      w.println("threshold " + ThresholdDecimals.of(threshold.getAsDouble())
          + " is now in force for automatic replies" + (db.isH2() ? ""
          : " (recorded in " + db.shown() + "; running replicas put it in force within "
          + "precedent.shared.poll-ms)"));
    } else {
      w.println("no threshold could be guaranteed; the threshold in force is unchanged");
    }
  }

  /**
   * Coverage and precision with the approval gate and without, at the guaranteed threshold (else
   * the one in force), and what approving drafted answers would add.
   */
  static void approval(PrintWriter w, DataDir dataDir, HeldOutEvaluation result,
      double inForce) {
    var guaranteed = result.guaranteedThreshold();
    double t = guaranteed.orElse(inForce);
    List<StoredAnswer> library;
    try {
      library = ApprovalCoverage.libraryFromCommandLine(dataDir);
    } catch (IOException e) {
      w.println("approval gate: " + Messages.oneLine(e) + " (the manager page shows these "
          + "figures while the service runs)");
      return;
    }
    // The service's default: only approved answers are sent by the queue.
    var r = ApprovalCoverage.of(result.report().outcomes(), t, library, true);
    w.printf(Locale.ROOT, "%nat threshold %s (%s), of %d held-out tickets:%n",
        ThresholdDecimals.of(t), guaranteed.isPresent() ? "guaranteed" : "in force",
        r.withoutGate().tickets());
    w.printf(Locale.ROOT, "  without the approval gate: %s answered automatically, %s right%n",
        share(r.withoutGate().coverage()), share(r.withoutGate().precision()));
    w.printf(Locale.ROOT, "  with the approval gate (%d approved answers): %s answered, %s right%n",
        r.approvedAnswers(), share(r.withGate().coverage()), share(r.withGate().precision()));
    if (r.additions().isEmpty()) {
      return;
    }
    w.printf(Locale.ROOT, "  approving these %d answers would add %.1f points of coverage (%s "
        + "right then):%n", r.additions().size(), r.pointsAdded(),
        share(r.afterApproving().precision()));
    for (var a : r.additions().subList(0, Math.min(LISTED, r.additions().size()))) {
      w.printf(Locale.ROOT, "    %-48s %3d tickets (%d right): %s%s%n", a.title(), a.tickets(),
          a.right(), String.join(", ", a.ticketIds()), a.tickets() > a.ticketIds().size()
              ? ", ..." : "");
    }
    if (r.additions().size() > LISTED) {
      w.printf(Locale.ROOT, "    and %d more (the manager page lists them all)%n",
          r.additions().size() - LISTED);
    }
  }

  private static String share(Double s) {
    return s == null ? "n/a" : String.format(Locale.ROOT, "%.1f%%", 100 * s);
  }

  /** The systems side by side, the recommendation, the safety hand-offs and the report files. */
  static void print(PrintWriter w, HeldOutEvaluation result) {
    EvaluationReport report = result.report();
    int all = result.questions().size();
    long inScope = result.inScope();
    w.printf(Locale.ROOT, "%d held-out tickets: %d with a known answer, %d out of scope%n",
        all, inScope, all - inScope);
    int width = report.systems().stream().mapToInt(s -> s.name().length()).max().orElse(6);
    String label = "%-" + width + "s";
    w.printf(Locale.ROOT, label + " %7s %7s %7s %7s %7s %7s %9s %9s%n", "system", "top-1", "MRR",
        "R@10", "ECE", "Brier", "AUROC", "cov@95%", "reranked");
    for (SystemReport s : report.systems()) {
      var m = s.measures();
      w.printf(Locale.ROOT, label + " %7.3f %7.3f %7.3f %7.3f %7.3f %7.3f %9.3f %8.0f%%%n", s.name(),
          m.top1(), m.meanReciprocalRank(), m.recallAt10(), m.expectedCalibrationError(),
          m.brierScore(), m.auroc(), m.coverageAt95(), 100 * s.rerankerRuns());
    }
    w.println("(the last system decides; 'reranked' is the share of tickets it ran the reranker "
        + "for, most of a decision's time)");
    w.println(HeldOutEvaluation.fused(report).recommendation().explanation());
    w.printf(Locale.ROOT, "%d of these tickets fall under a safety rule or a people-only category: in "
        + "service they are handed off whatever the confidence (the figures above measure the model "
        + "alone)%n", result.safetyHandOffs());
    w.println("report: " + result.html());
    w.println("        " + result.json());
  }
}
