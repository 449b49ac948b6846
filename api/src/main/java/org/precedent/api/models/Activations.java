package org.precedent.api.models;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.precedent.engine.evaluate.VersionComparison;
import org.precedent.engine.evaluate.VersionComparisons;
import org.precedent.engine.measure.ThresholdDecimals;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.knowledge.store.DataDir;

/**
 * The rule every activation follows, through the service or the command line: a version goes in
 * force over another when {@code evaluate} compared the two on the same held-out tickets, over
 * the knowledge in force and the model files as they are, and the new one answers at least as
 * many of those tickets at the target precision. Otherwise the activation needs the caller's
 * acknowledgement beside the reason, and the audit record keeps both and the comparison.
 */
public final class Activations {
  private Activations() {}

  /**
   * What an activation shows.
   *
   * @param candidate  the version to put in force
   * @param inForce    the version in force now
   * @param comparison the comparison evaluate made of the two, or null when there is none
   * @param objection  why the activation needs an acknowledgement, or null when it needs none
   */
  public record Verdict(String candidate, String inForce, VersionComparison comparison,
      String objection) {
    public boolean needsAcknowledgement() {
      return objection != null;
    }
  }

  /**
   * Judges putting {@code candidate} in force over {@code inForce} (null: none is in force, and
   * the first version needs no comparison).
   *
   * @throws org.precedent.engine.rerank.ModelLoadException naming the file when the candidate's
   *     files or its comparison file cannot be trusted (never overridden by an acknowledgement)
   */
  public static Verdict judge(DataDir dir, String inForce, String candidate) throws IOException {
    ModelStore store = new ModelStore(dir.models());
    store.verify(candidate);
    if (inForce == null || candidate.equals(inForce)) {
      return new Verdict(candidate, inForce, null, null);
    }
    Optional<VersionComparison> read = VersionComparisons.read(store, candidate, inForce);
    if (read.isEmpty()) {
      return new Verdict(candidate, inForce, null, candidate + " has not been compared with "
          + inForce + ", the version in force: run 'precedent evaluate FILE' on held-out "
          + "tickets (it measures the newest version beside the one in force, or --candidate "
          + candidate + ")");
    }
    VersionComparison c = read.get();
    String generation = dir.currentGeneration().map(Path::getFileName).map(Path::toString)
        .orElse("none");
    String objection = null;
    if (!generation.equals(c.knowledgeGeneration())) {
      objection = "the comparison was made over knowledge " + c.knowledgeGeneration() + ", but "
          + generation + " is in force now: evaluate again";
    } else if (!store.fingerprint(candidate).equals(c.candidateManifest())) {
      objection = "the files of " + candidate + " are not the ones compared (its manifest "
          + "changed since): evaluate again";
    } else if (!store.fingerprint(inForce).equals(c.inForceManifest())) {
      objection = "the files of " + inForce + " are not the ones compared (its manifest "
          + "changed since): evaluate again";
    } else if (c.candidateWorse()) {
      objection = String.format(Locale.ROOT, "%s answers %s of the %d held-out tickets at "
          + "%s precision, %s answers %s: %.1f points fewer", candidate,
          percent(c.candidateFigures().coverage()), c.tickets(), percent(c.targetPrecision()),
          inForce, percent(c.inForceFigures().coverage()),
          -100 * c.difference().coverage());
    }
    return new Verdict(candidate, inForce, c, objection);
  }

  /** The comparison side by side, as the command line prints it (evaluate, activate). */
  public static List<String> lines(VersionComparison c) {
    List<String> out = new ArrayList<>();
    out.add(String.format(Locale.ROOT, "%s (candidate) beside %s (in force) on the same %d "
        + "held-out tickets (%s), each at its guaranteed threshold for %s precision:",
        c.candidate(), c.inForce(), c.tickets(), c.heldOut(), percent(c.targetPrecision())));
    String row = "  %-28s %12s %12s %12s";
    out.add(String.format(Locale.ROOT, row, "", c.inForce(), c.candidate(), "difference"));
    var f = c.inForceFigures();
    var n = c.candidateFigures();
    var d = c.difference();
    out.add(String.format(Locale.ROOT, row, "fused top-1", decimal(f.top1()), decimal(n.top1()),
        signed(d.top1())));
    out.add(String.format(Locale.ROOT, row, "guaranteed threshold", threshold(f.threshold()),
        threshold(n.threshold()), ""));
    out.add(String.format(Locale.ROOT, row, "coverage at " + percent(c.targetPrecision())
        + " precision", percent(f.coverage()), percent(n.coverage()), points(d.coverage())));
    out.add(String.format(Locale.ROOT, row, "precision at the threshold",
        f.precision() == null ? "n/a" : percent(f.precision()),
        n.precision() == null ? "n/a" : percent(n.precision()), points(d.precision())));
    return out;
  }

  static String percent(double share) {
    return String.format(Locale.ROOT, "%.1f%%", 100 * share);
  }

  private static String decimal(Double v) {
    return v == null ? "n/a" : String.format(Locale.ROOT, "%.3f", v);
  }

  private static String signed(Double v) {
    return v == null ? "" : String.format(Locale.ROOT, "%+.3f", v);
  }

  private static String points(Double v) {
    return v == null ? "" : String.format(Locale.ROOT, "%+.1f points", 100 * v);
  }

  private static String threshold(Double t) {
    return t == null ? "none" : ThresholdDecimals.of(t);
  }
}
