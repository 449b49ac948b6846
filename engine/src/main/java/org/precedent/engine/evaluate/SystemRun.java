package org.precedent.engine.evaluate;

import java.util.HashSet;
import java.util.List;
import java.util.Objects;
import java.util.Set;

/**
 * One system's results on a held-out set of tickets.
 *
 * @param name    how the system is labelled in the report
 * @param tickets one entry per ticket, each ticket at most once
 */
public record SystemRun(String name, List<EvaluatedTicket> tickets) {
  public SystemRun {
    Objects.requireNonNull(name, "system name");
    if (name.isBlank()) {
      throw new IllegalArgumentException("system name is blank");
    }
    tickets = List.copyOf(Objects.requireNonNull(tickets, "tickets"));
    if (tickets.isEmpty()) {
      throw new IllegalArgumentException("system " + name + " has no evaluated tickets");
    }
    Set<String> seen = new HashSet<>();
    for (EvaluatedTicket t : tickets) {
      if (!seen.add(t.ticketId())) {
        // A ticket counted twice would weigh double in every measure.
        throw new IllegalArgumentException("system " + name + " lists ticket " + t.ticketId() + " twice");
      }
    }
  }
}
