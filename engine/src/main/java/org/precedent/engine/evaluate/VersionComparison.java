package org.precedent.engine.evaluate;

import java.time.Instant;
import java.util.Objects;
import org.precedent.engine.measure.ThresholdRecommendation;

/**
 * A candidate model version measured beside the version in force on the same held-out tickets,
 * each under the same threshold rule: its own guaranteed threshold at the target precision
 * ({@code GuaranteedThreshold}). What an activation shows, and what it is refused on: a candidate
 * that answers fewer held-out tickets at the target precision than the version in force.
 *
 * @param candidate           the version compared
 * @param candidateManifest   SHA-256 of its manifest (so of every file of it) when compared
 * @param inForce             the version in force it was compared with
 * @param inForceManifest     SHA-256 of that version's manifest when compared
 * @param knowledgeGeneration the knowledge generation both ran over (their retrieval)
 * @param heldOut             the held-out file's name
 * @param heldOutSha256       its SHA-256
 * @param tickets             held-out tickets measured
 * @param inScopeTickets      of those, tickets with a right past answer
 * @param targetPrecision     the precision the guaranteed thresholds had to reach
 * @param createdAt           when the comparison was made
 * @param candidateFigures    the candidate's figures
 * @param inForceFigures      the version in force's figures
 * @param difference          candidate minus version in force
 * @param candidateWorse      the candidate's coverage at the target precision is lower
 */
public record VersionComparison(String candidate, String candidateManifest, String inForce,
    String inForceManifest, String knowledgeGeneration, String heldOut, String heldOutSha256,
    int tickets, int inScopeTickets, double targetPrecision, Instant createdAt,
    Figures candidateFigures, Figures inForceFigures, Difference difference,
    boolean candidateWorse) {
  public VersionComparison {
    Objects.requireNonNull(candidate, "candidate");
    Objects.requireNonNull(inForce, "version in force");
    Objects.requireNonNull(candidateFigures, "candidate figures");
    Objects.requireNonNull(inForceFigures, "figures in force");
    Objects.requireNonNull(difference, "difference");
    Objects.requireNonNull(createdAt, "created time");
  }

  /**
   * One version's figures on the held-out tickets.
   *
   * @param top1      the fused system's top-1 on in-scope tickets (null when none is in scope)
   * @param threshold its guaranteed threshold at the target precision, or null when none could be
   *                  guaranteed
   * @param coverage  share of held-out tickets that threshold answers (0 without one)
   * @param precision share of those answers that were right (null without a threshold)
   */
  public record Figures(Double top1, Double threshold, double coverage, Double precision) {
    /** The fused system's figures in a report. */
    public static Figures of(EvaluationReport report) {
      SystemReport fused = HeldOutEvaluation.fused(report);
      ThresholdRecommendation r = fused.recommendation();
      boolean ok = r.repliesAutomatically();
      double top1 = fused.measures().top1();
      return new Figures(Double.isNaN(top1) ? null : top1, ok ? r.threshold() : null,
          ok ? r.coverage() : 0.0, ok ? r.empiricalPrecision() : null);
    }
  }

  /**
   * Candidate minus version in force; null where either figure is undefined.
   *
   * @param top1      difference of top-1
   * @param coverage  difference of coverage at the target precision
   * @param precision difference of precision at each one's threshold
   */
  public record Difference(Double top1, double coverage, Double precision) {
    static Difference of(Figures candidate, Figures inForce) {
      return new Difference(minus(candidate.top1(), inForce.top1()),
          candidate.coverage() - inForce.coverage(),
          minus(candidate.precision(), inForce.precision()));
    }

    private static Double minus(Double a, Double b) {
      return a == null || b == null ? null : a - b;
    }
  }

  /** Where the two versions were measured, and on what. */
  public record Basis(String candidateManifest, String inForceManifest,
      String knowledgeGeneration, String heldOut, String heldOutSha256) {}

  /**
   * Compares two reports made on the same held-out tickets with the same target precision.
   *
   * @throws IllegalArgumentException when they were not
   */
  public static VersionComparison of(String candidate, EvaluationReport candidateReport,
      String inForce, EvaluationReport inForceReport, Basis basis, Instant at) {
    if (candidateReport.tickets() != inForceReport.tickets()
        || candidateReport.inScopeTickets() != inForceReport.inScopeTickets()
        || candidateReport.targetPrecision() != inForceReport.targetPrecision()) {
      throw new IllegalArgumentException("the reports of " + candidate + " and " + inForce
          + " were not made on the same held-out tickets with the same target precision");
    }
    Figures c = Figures.of(candidateReport);
    Figures f = Figures.of(inForceReport);
    return new VersionComparison(candidate, basis.candidateManifest(), inForce,
        basis.inForceManifest(), basis.knowledgeGeneration(), basis.heldOut(),
        basis.heldOutSha256(), inForceReport.tickets(), inForceReport.inScopeTickets(),
        inForceReport.targetPrecision(), at, c, f, Difference.of(c, f),
        c.coverage() < f.coverage());
  }
}
