package org.precedent.api.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Path;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.RegisterExtension;
import org.precedent.api.testing.PostgresForClass;
import org.precedent.api.testing.TrainedData;

/** {@code benchmark queue} against a real PostgreSQL server, at a small size. */
class QueueBenchmarkTest {
  @RegisterExtension
  static final PostgresForClass postgres = new PostgresForClass();

  private static String run(int expected, String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int status = PrecedentCommand.run(new PrintWriter(out, true), new PrintWriter(err, true),
        args);
    System.out.print(out);
    assertEquals(expected, status, err + "\n" + out);
    return out.toString();
  }

  @Test
  void drainsWithOneAndTwoReplicasAndDecidesEachTicketOnce() {
    String out = run(0, "benchmark", "queue", "--db-url", postgres.url(), "--db-user",
        "postgres", "--tickets", "1000", "--hand-off-only");
    assertTrue(out.contains("decided by a fixed hand-off"), out);
    assertTrue(out.contains("1 replica: 1,000 tickets drained"), out);
    assertTrue(out.contains("2 replicas: 1,000 tickets drained"), out);
    assertEquals(2, out.split("outcomes \\{HAND_OFF=1000\\}; decided once: 1,000", -1).length - 1,
        out);
    assertTrue(out.contains("2 replicas / 1 replica: "), out);
  }

  @Test
  void decidesWithTheModelInForce() {
    Path data = TrainedData.copy();
    try {
      // 16 tickets: each run a few seconds with the test's tiny model.
      String out = run(0, "--data", data.toString(), "benchmark", "queue", "--db-url",
          postgres.url(), "--db-user", "postgres", "--tickets", "16");
      assertTrue(out.contains("decided by model v-0001 of " + data), out);
      assertEquals(2, out.split("decided once: 16\n", -1).length - 1, out);
      // Real decisions: the outcomes add up, and the decision itself takes time (the fixed
      // hand-off takes none).
      Matcher m = Pattern.compile("outcomes \\{([^}]*)\\}").matcher(out);
      assertTrue(m.find(), out);
      int total = 0;
      for (String outcome : m.group(1).split(", ")) {
        total += Integer.parseInt(outcome.split("=")[1]);
      }
      assertEquals(16, total, out);
      Matcher p50 = Pattern.compile("decision p50 ([0-9.]+) ms").matcher(out);
      assertTrue(p50.find() && Double.parseDouble(p50.group(1)) > 0.5, out);
    } finally {
      TrainedData.delete(data);
    }
  }

  @Test
  void saysWhatIsMissingWithoutATrainedModel() {
    Path empty = TrainedData.root().resolve("api/target/no-model-" + System.nanoTime());
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int status = PrecedentCommand.run(new PrintWriter(out, true), new PrintWriter(err, true),
        "--data", empty.toString(), "benchmark", "queue", "--db-url", postgres.url(),
        "--tickets", "5");
    assertEquals(PrecedentCommand.FAILED, status);
    assertTrue(err.toString().contains("no tickets or no trained model in " + empty)
        && err.toString().contains("--hand-off-only"), err.toString());
  }
}
