package org.precedent.api.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.RegisterExtension;
import org.precedent.api.testing.PostgresForClass;

/** {@code benchmark queue} against a real PostgreSQL server, at a small size. */
class QueueBenchmarkTest {
  @RegisterExtension
  static final PostgresForClass postgres = new PostgresForClass();

  @Test
  void drainsWithOneAndTwoReplicasAndDecidesEachTicketOnce() {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int status = PrecedentCommand.run(new PrintWriter(out, true), new PrintWriter(err, true),
        "benchmark", "queue", "--db-url", postgres.url(), "--db-user", "postgres", "--tickets",
        "1000");
    System.out.print(out);
    assertEquals(0, status, err.toString());
    assertTrue(out.toString().contains("1 replica: 1,000 tickets drained"), out.toString());
    assertTrue(out.toString().contains("2 replicas: 1,000 tickets drained"), out.toString());
    assertEquals(2, out.toString().split("decided once: 1,000", -1).length - 1, out.toString());
    assertTrue(out.toString().contains("2 replicas / 1 replica: "), out.toString());
  }
}
