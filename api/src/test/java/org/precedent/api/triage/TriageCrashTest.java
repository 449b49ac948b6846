package org.precedent.api.triage;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.regex.Pattern;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.precedent.api.cli.PrecedentCommand;
import org.precedent.api.testing.ChildJvm;
import org.precedent.api.testing.TrainedData;

/** Triage killed mid-run resumes without repeating or skipping a ticket. */
class TriageCrashTest {
  static final ObjectMapper JSON = new ObjectMapper();
  static final String[] QUESTIONS = {"My green bin was not emptied", "How do I send a meter "
      + "reading?", "Can I pay my bill in instalments?", "Low water pressure in the shower",
      "The water from my tap is brown", "Who won the village fete cake contest?"};
  Path data;

  @AfterEach
  void clean() {
    TrainedData.delete(data);
  }

  private Path newTickets(int n) throws Exception {
    StringBuilder s = new StringBuilder();
    for (int i = 0; i < n; i++) {
      s.append(JSON.writeValueAsString(Map.of("ref", "N-" + i, "text",
          QUESTIONS[i % QUESTIONS.length] + " (" + i + ")"))).append('\n');
    }
    Path in = data.resolve("new.jsonl");
    Files.writeString(in, s);
    return in;
  }

  private static List<String> ids(Path out) throws Exception {
    List<String> ids = new ArrayList<>();
    for (String line : Files.readAllLines(out)) {
      JsonNode n = JSON.readTree(line);
      assertTrue(n.has("outcome"), line);
      ids.add(n.get("id").asText());
    }
    return ids;
  }

  private static List<String> summary(List<String> lines) throws Exception {
    List<String> out = new ArrayList<>();
    for (String line : lines) {
      JsonNode n = JSON.readTree(line);
      out.add(n.get("id").asText() + " " + n.get("outcome").asText() + " "
          + n.path("answerGroup").asText());
    }
    return out;
  }

  @Test
  void aKilledRunResumesWithoutRepeatsOrGaps() throws Exception {
    data = TrainedData.copy();
    int n = 150;
    Path in = newTickets(n);
    Path out = data.resolve("decisions.jsonl");
    Path progress = out.resolveSibling("decisions.jsonl.progress");
    String[] args = {"triage", "--data", data.toString(), "--in", in.toString(), "--out",
        out.toString(), "--id", "ref", "--question", "text", "--commit-every", "7"};
    try (ChildJvm child = ChildJvm.start(data.resolve("triage.log"), args)) {
      Pattern committed = Pattern.compile("tickets=([2-9]\\d|1[0-4]\\d)\\b");
      long until = System.nanoTime() + Duration.ofSeconds(180).toNanos();
      while (System.nanoTime() < until) {
        if (Files.exists(progress) && committed.matcher(Files.readString(progress)).find()) {
          break;
        }
        Thread.sleep(20);
      }
      child.kill();
    }
    String saved = Files.readString(progress);
    long done = Long.parseLong(saved.replaceAll("(?s).*tickets=(\\d+).*", "$1"));
    assertTrue(done >= 20 && done < n, "killed mid-run after " + done + " tickets");
    // What was committed before the kill is on disk, in input order; after it there may be a
    // torn tail, which the resumed run cuts off.
    List<String> lines = Files.readAllLines(out);
    assertTrue(lines.size() >= done, lines.size() + " lines for " + done + " committed");
    for (int i = 0; i < done; i++) {
      assertEquals("N-" + i, JSON.readTree(lines.get(i)).get("id").asText(), "line " + (i + 1));
    }

    ByteArrayOutputStream printed = new ByteArrayOutputStream();
    PrintStream original = System.out;
    int status;
    try {
      System.setOut(new PrintStream(printed, true, StandardCharsets.UTF_8));
      status = PrecedentCommand.run(args);
    } finally {
      System.setOut(original);
    }
    assertEquals(0, status, printed.toString(StandardCharsets.UTF_8));
    assertTrue(printed.toString(StandardCharsets.UTF_8).contains("resumed after " + done));
    List<String> expected = new ArrayList<>();
    for (int i = 0; i < n; i++) {
      expected.add("N-" + i);
    }
    assertEquals(expected, ids(out));
    assertFalse(Files.exists(progress), "a finished run leaves no progress file");
  }

  @Test
  void aTornTailAfterTheLastCommitIsCutOff() throws Exception {
    data = TrainedData.copy();
    Path in = newTickets(12);
    Path out = data.resolve("decisions.jsonl");
    String[] args = {"triage", "--data", data.toString(), "--in", in.toString(), "--out",
        out.toString(), "--id", "ref", "--question", "text", "--commit-every", "5"};
    assertEquals(0, PrecedentCommand.run(args));
    List<String> lines = Files.readAllLines(out);
    // As if a run had committed 5 tickets, then written 2 more lines and half of one, and died.
    String committed = String.join("\n", lines.subList(0, 5)) + "\n";
    Files.writeString(out, committed + lines.get(5) + "\n" + lines.get(6) + "\n"
        + lines.get(7).substring(0, 20));
    new TriageProgress(5, committed.getBytes(StandardCharsets.UTF_8).length, Files.size(in))
        .write(out);
    assertEquals(0, PrecedentCommand.run(args));
    // The same tickets in the same order with the same decisions; the last digits of a
    // confidence may differ between runs (native floating point), so they are not compared.
    assertEquals(summary(lines), summary(Files.readAllLines(out)));
  }

  @Test
  void anExistingOutputWithoutProgressIsNotOverwritten() throws Exception {
    data = TrainedData.copy();
    Path in = newTickets(3);
    Path out = data.resolve("keep.jsonl");
    Files.writeString(out, "precious\n");
    int status = PrecedentCommand.run("triage", "--data", data.toString(), "--in", in.toString(),
        "--out", out.toString(), "--question", "text");
    assertEquals(1, status);
    assertEquals("precious\n", Files.readString(out));
  }
}
