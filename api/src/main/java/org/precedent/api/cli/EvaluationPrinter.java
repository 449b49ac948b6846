package org.precedent.api.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.util.List;
import java.util.Locale;
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

  /** The systems side by side, the recommendation, the safety hand-offs and the report files. */
  static void print(PrintWriter w, HeldOutEvaluation result) {
    EvaluationReport report = result.report();
    int all = result.questions().size();
    long inScope = result.inScope();
    w.printf(Locale.ROOT, "%d held-out tickets: %d with a known answer, %d out of scope%n",
        all, inScope, all - inScope);
    w.printf(Locale.ROOT, "%-16s %7s %7s %7s %7s %7s %7s %9s%n", "system", "top-1", "MRR",
        "R@10", "ECE", "Brier", "AUROC", "cov@95%");
    for (SystemReport s : report.systems()) {
      var m = s.measures();
      w.printf(Locale.ROOT, "%-16s %7.3f %7.3f %7.3f %7.3f %7.3f %7.3f %9.3f%n", s.name(), m.top1(),
          m.meanReciprocalRank(), m.recallAt10(), m.expectedCalibrationError(), m.brierScore(),
          m.auroc(), m.coverageAt95());
    }
    w.println(HeldOutEvaluation.fused(report).recommendation().explanation());
    w.printf(Locale.ROOT, "%d of these tickets fall under a safety rule or a people-only category: in "
        + "service they are handed off whatever the confidence (the figures above measure the model "
        + "alone)%n", result.safetyHandOffs());
    w.println("report: " + result.html());
    w.println("        " + result.json());
  }
}
