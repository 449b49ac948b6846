package org.precedent.engine.evaluate;

import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.OptionalDouble;
import java.util.Set;
import org.precedent.engine.measure.GuaranteedThreshold;

/** Builds an {@link EvaluationReport} from system runs, using the measures library for every number. */
public final class EvaluationReports {
  /** Most risk-coverage points kept per system: enough for a smooth line, small enough for a page. */
  public static final int MAX_CURVE_POINTS = 200;

  private EvaluationReports() {}

  /**
   * A report with delta {@value GuaranteedThreshold#DEFAULT_DELTA}, built now; where no threshold can
   * be guaranteed, the per-category table uses the measured threshold (see
   * {@link CategoryTable.Basis#MEASURED}).
   */
  public static EvaluationReport build(String dataset, List<SystemRun> runs, double targetPrecision) {
    return build(dataset, runs, targetPrecision, OptionalDouble.empty(), Instant.now());
  }

  /**
   * A report with delta {@value GuaranteedThreshold#DEFAULT_DELTA}.
   *
   * @param givenThreshold threshold for the per-category table of a system whose recommendation is
   *                       not OK; empty to use the measured one
   * @param createdAt      time stamp to record
   * @throws IllegalArgumentException when the runs are empty, share a name, or do not cover the same
   *                                  tickets with the same category and scope: systems compared on
   *                                  different tickets would not be comparable
   */
  public static EvaluationReport build(String dataset, List<SystemRun> runs, double targetPrecision,
      OptionalDouble givenThreshold, Instant createdAt) {
    Objects.requireNonNull(dataset, "dataset");
    Objects.requireNonNull(givenThreshold, "given threshold");
    Objects.requireNonNull(createdAt, "created time");
    if (!(targetPrecision > 0.0 && targetPrecision < 1.0)) {
      throw new IllegalArgumentException("target precision must lie strictly between 0 and 1; got " + targetPrecision);
    }
    givenThreshold.ifPresent(t -> {
      if (!(t >= 0.0 && t <= 1.0)) {
        throw new IllegalArgumentException("given threshold must lie in [0, 1]; got " + t);
      }
    });
    List<SystemRun> all = List.copyOf(Objects.requireNonNull(runs, "runs"));
    if (all.isEmpty()) {
      throw new IllegalArgumentException("a report needs at least one system run");
    }
    checkComparable(all);
    double delta = GuaranteedThreshold.DEFAULT_DELTA;
    List<SystemReport> systems = new ArrayList<>(all.size());
    for (SystemRun run : all) {
      systems.add(SystemEvaluation.of(run, targetPrecision, delta, givenThreshold));
    }
    List<EvaluatedTicket> first = all.get(0).tickets();
    int inScope = (int) first.stream().filter(EvaluatedTicket::inScope).count();
    List<HeldOutOutcome> outcomes = all.get(all.size() - 1).tickets().stream()
        .map(HeldOutOutcome::of).toList();
    return new EvaluationReport(dataset, createdAt, first.size(), inScope, targetPrecision, delta,
        systems, outcomes);
  }

  private static void checkComparable(List<SystemRun> runs) {
    Set<String> names = new HashSet<>();
    Map<String, String> reference = signature(runs.get(0));
    for (SystemRun run : runs) {
      if (!names.add(run.name())) {
        throw new IllegalArgumentException("two systems are named " + run.name());
      }
      if (!signature(run).equals(reference)) {
        throw new IllegalArgumentException("system " + run.name() + " was not evaluated on the same tickets"
            + " (ids, categories and scope) as system " + runs.get(0).name());
      }
    }
  }

  private static Map<String, String> signature(SystemRun run) {
    Map<String, String> out = new HashMap<>();
    for (EvaluatedTicket t : run.tickets()) {
      out.put(t.ticketId(), t.inScope() + "\u0000" + t.category());
    }
    return out;
  }
}
