package org.precedent.engine.evaluate;

import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;

/** Small hand-made runs whose measures are worked out by hand in the tests. */
final class Fixtures {
  static final Instant CREATED = Instant.parse("2024-03-01T09:30:00Z");

  private Fixtures() {}

  /**
   * Six tickets. The reply (top candidate) is right only for t1 and t3:
   * t1 billing rank 1 conf 0.9 (right), t2 billing rank 2 conf 0.8, t3 login rank 1 conf 0.7 (right),
   * t4 login absent conf 0.4, t5 login out of scope conf 0.6, t6 billing rank 5 conf 0.2.
   */
  static SystemRun sixTickets(String name) {
    return new SystemRun(name, List.of(
        new EvaluatedTicket("t1", "billing", true, 1, 0.9),
        new EvaluatedTicket("t2", "billing", true, 2, 0.8),
        new EvaluatedTicket("t3", "login", true, 1, 0.7),
        new EvaluatedTicket("t4", "login", true, 0, 0.4),
        new EvaluatedTicket("t5", "login", false, 0, 0.6),
        new EvaluatedTicket("t6", "billing", true, 5, 0.2)));
  }

  /** As {@link #sixTickets} but t2's right answer moved to rank 1: top-1 goes from 2/5 to 3/5. */
  static SystemRun sixTicketsImproved(String name) {
    List<EvaluatedTicket> tickets = new ArrayList<>(sixTickets(name).tickets());
    tickets.set(1, new EvaluatedTicket("t2", "billing", true, 1, 0.8));
    return new SystemRun(name, tickets);
  }

  /**
   * 300 tickets in one category: 250 right replies with confidence 0.600..0.849 and 50 wrong ones
   * with confidence 0.100..0.149, so high thresholds are clean and a guarantee is possible.
   */
  static SystemRun separable(String name, String category) {
    List<EvaluatedTicket> tickets = new ArrayList<>();
    for (int i = 0; i < 250; i++) {
      tickets.add(new EvaluatedTicket("r" + i, category, true, 1, 0.6 + i / 1000.0));
    }
    for (int i = 0; i < 50; i++) {
      tickets.add(new EvaluatedTicket("w" + i, category, true, 3, 0.1 + i / 1000.0));
    }
    return new SystemRun(name, tickets);
  }

  static EvaluationReport report(String dataset, SystemRun... runs) {
    return EvaluationReports.build(dataset, List.of(runs), 0.95, OptionalDouble.empty(), CREATED);
  }
}
