package org.precedent.api.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The command line as a user meets it: help, exit statuses and one-line errors. */
class CommandLineTest {
  @TempDir
  Path tmp;

  private record Run(int status, String out, String err) {}

  private Run run(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int status = PrecedentCommand.run(new PrintWriter(out, true), new PrintWriter(err, true), args);
    return new Run(status, out.toString(), err.toString());
  }

  @Test
  void everySubCommandHasHelp() {
    for (List<String> command : List.of(List.of("ingest"), List.of("ask"), List.of("train"),
        List.of("evaluate"), List.of("demo"), List.of("benchmark", "retrieval"),
        List.of("benchmark", "reranker"), List.of("benchmark", "clinc150"),
        List.of("benchmark", "service"), List.of("serve"), List.of("triage"))) {
      String[] args = java.util.stream.Stream.concat(command.stream(), java.util.stream.Stream.of(
          "--help")).toArray(String[]::new);
      Run r = run(args);
      assertEquals(0, r.status(), command + ": " + r.err());
      assertTrue(r.out().startsWith("Usage: precedent " + String.join(" ", command)), r.out());
    }
  }

  @Test
  void ingestExitsWithThreeWhenRowsAreRejectedAndListsThem() throws Exception {
    Path csv = Files.writeString(tmp.resolve("t.csv"), """
        id,q,a
        1,how do I pay my bill,You can pay online at any time.
        2,,You can pay online at any time.
        3,can I pay by card,You can pay online at any time.
        4,pay by phone?,You can pay online at any time.
        """);
    Run r = run("--data", tmp.resolve("data").toString(), "ingest", csv.toString(), "--id", "id",
        "--question", "q", "--reply", "a", "--quiet");
    assertEquals(PrecedentCommand.ROWS_REJECTED, r.status(), r.err());
    assertTrue(r.err().contains("rejected: " + csv + ":3: field question: empty"), r.err());
    assertTrue(r.out().contains("read 4, stored 3, updated 0, rejected 1"), r.out());
    assertTrue(r.out().contains("1 answer groups"), r.out());
  }

  @Test
  void aMissingFileIsOneLineAndExitOne() {
    Path absent = tmp.resolve("absent.csv");
    Run r = run("--data", tmp.resolve("data").toString(), "ingest", absent.toString(),
        "--question", "q", "--reply", "a");
    assertEquals(PrecedentCommand.FAILED, r.status());
    assertTrue(r.err().startsWith("precedent ingest: " + absent + ": no such file"), r.err());
    assertTrue(r.err().contains("nothing was stored"), r.err());
  }

  @Test
  void aMissingFileIsReportedBeforeAMissingMapping() {
    Path absent = tmp.resolve("absent.csv");
    String data = tmp.resolve("data").toString();
    for (List<String> args : List.of(List.of("ingest", absent.toString()),
        List.of("ingest", absent.toString(), "--mapping", tmp.resolve("absent.properties").toString()),
        List.of("evaluate", absent.toString()),
        List.of("triage", "--in", absent.toString(), "--out", tmp.resolve("out.jsonl").toString()))) {
      List<String> all = new java.util.ArrayList<>(List.of("--data", data));
      all.addAll(args);
      Run r = run(all.toArray(String[]::new));
      assertEquals(PrecedentCommand.FAILED, r.status(), args.toString());
      assertTrue(r.err().startsWith("precedent"), r.err());
      assertTrue(r.err().contains(absent + ": no such file"), args + ": " + r.err());
      assertFalse(r.err().contains("column"), args + ": " + r.err());
      assertFalse(r.err().contains("mapping"), args + ": " + r.err());
    }
  }

  @Test
  void askBeforeAnyIngestSaysWhatToDo() {
    Run r = run("--data", tmp.resolve("empty").toString(), "ask", "hello");
    assertEquals(PrecedentCommand.FAILED, r.status());
    assertTrue(r.err().contains("run 'precedent ingest FILE' first"), r.err());
  }
}
