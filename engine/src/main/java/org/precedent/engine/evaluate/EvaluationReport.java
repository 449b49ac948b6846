package org.precedent.engine.evaluate;

import java.time.Instant;
import java.util.List;
import java.util.Objects;

/**
 * The evaluation of one or more systems on the same held-out tickets; written to JSON and rendered
 * as HTML.
 *
 * @param dataset         name of the held-out set
 * @param createdAt       when the report was built
 * @param tickets         held-out tickets (every system saw the same ones)
 * @param inScopeTickets  of those, tickets that have a right past answer
 * @param targetPrecision the precision the threshold recommendation had to guarantee
 * @param delta           allowed chance that the guarantee fails
 * @param systems         one entry per system, in the order given
 * @param outcomes        the last system's (the fused one's, which the service decides with)
 *                        answer per ticket, in the order run; empty in reports made before it was
 *                        kept
 */
public record EvaluationReport(
    String dataset,
    Instant createdAt,
    int tickets,
    int inScopeTickets,
    double targetPrecision,
    double delta,
    List<SystemReport> systems,
    List<HeldOutOutcome> outcomes) {
  public EvaluationReport {
    Objects.requireNonNull(dataset, "dataset");
    Objects.requireNonNull(createdAt, "created time");
    systems = List.copyOf(systems);
    outcomes = outcomes == null ? List.of() : List.copyOf(outcomes);
  }
}
