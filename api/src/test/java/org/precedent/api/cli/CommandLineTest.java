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

  /** Every command and sub-command, as typed after {@code precedent}. */
  private static final List<List<String>> COMMANDS = List.of(List.of(), List.of("ingest"),
      List.of("ask"), List.of("train"), List.of("evaluate"), List.of("serve"), List.of("triage"),
      List.of("demo"), List.of("benchmark"), List.of("benchmark", "retrieval"),
      List.of("benchmark", "reranker"), List.of("benchmark", "clinc150"),
      List.of("benchmark", "service"));

  /** The width help is written for: a classic terminal (common practice, no source). */
  private static final int WIDTH = 80;

  /**
   * A command's help, and what picocli itself printed to the process's standard error meanwhile
   * (it warns there, not on the command's error writer).
   */
  private record Help(List<String> command, String text, String warnings) {
    List<String> lines() {
      return text.lines().toList();
    }
  }

  private Help help(List<String> command) {
    java.io.PrintStream saved = System.err;
    java.io.ByteArrayOutputStream warnings = new java.io.ByteArrayOutputStream();
    Run r;
    try {
      System.setErr(new java.io.PrintStream(warnings, true, java.nio.charset.StandardCharsets.UTF_8));
      List<String> args = new java.util.ArrayList<>(command);
      args.add("--help");
      r = run(args.toArray(String[]::new));
    } finally {
      System.setErr(saved);
    }
    assertEquals(0, r.status(), command + ": " + r.err());
    assertEquals("", r.err(), command.toString());
    return new Help(command, r.out(), warnings.toString(java.nio.charset.StandardCharsets.UTF_8));
  }

  @Test
  void everyCommandHasHelpWithoutWarnings() {
    for (List<String> command : COMMANDS) {
      Help h = help(command);
      assertTrue(h.text().startsWith(("Usage: precedent " + String.join(" ", command)).strip()),
          h.text());
      assertEquals("", h.warnings(), command + ": picocli warned while writing the help");
      assertFalse(h.text().contains("%n") || h.text().matches("(?s).*%[^%\\s].*"),
          command + ": an unformatted % in\n" + h.text());
    }
    assertTrue(help(List.of("evaluate")).text().replaceAll("\\s+", " ")
        .contains("target precision with 95% confidence"), "the percent sign itself is shown");
  }

  @Test
  void helpReadsAsWholeLinesAtEightyColumns() {
    for (List<String> command : COMMANDS) {
      List<String> lines = help(command).lines();
      for (int i = 0; i < lines.size(); i++) {
        String a = lines.get(i);
        assertTrue(a.length() <= WIDTH, command + ": longer than " + WIDTH + ": " + a);
        if (i + 1 == lines.size() || lines.get(i + 1).isBlank() || a.endsWith(":")) {
          continue;
        }
        // Whether the next line goes on with this line's text: paragraphs start at column 0; a
        // wrapped option or command description is indented further than its first line.
        String b = lines.get(i + 1).strip();
        int indentA = a.length() - a.stripLeading().length();
        int indentB = lines.get(i + 1).length() - lines.get(i + 1).stripLeading().length();
        if (indentB < indentA || (indentB == indentA && indentA > 0 && indentA <= 6)) {
          continue;
        }
        String where = command + ": lines\n" + a + "\n" + lines.get(i + 1);
        // A word such as ~/.precedent or mapping.properties cut in two at a '.', '/' or '-'.
        assertFalse(a.endsWith("/") || (a.matches(".*[.-]") && Character.isLowerCase(b.charAt(0))),
            "a word is cut at the end of a line: " + where);
        // A sentence broken before the line is full: the next word would have fitted, with a few
        // columns to spare for the margin picocli keeps.
        String next = b.split(" ")[0];
        assertFalse((Character.isLowerCase(b.charAt(0)) || b.startsWith("("))
            && a.length() + 1 + next.length() <= WIDTH - 4,
            "a line broken before it is full: " + where);
      }
    }
  }

  @Test
  void helpHasBalancedParentheses() {
    for (List<String> command : COMMANDS) {
      String text = help(command).text();
      int depth = 0;
      for (char c : text.toCharArray()) {
        depth += c == '(' ? 1 : c == ')' ? -1 : 0;
        assertTrue(depth >= 0, command + ": a ')' with no '(' in\n" + text);
      }
      assertEquals(0, depth, command + ": a '(' never closed in\n" + text);
    }
  }

  @Test
  void commandListsDescribeEachCommandInAWholeSentence() {
    for (List<String> command : List.of(List.<String>of(), List.of("benchmark"))) {
      List<String> lines = help(command).lines();
      int start = lines.indexOf("Commands:");
      assertTrue(start > 0, command + ": no list of commands");
      List<String> entries = new java.util.ArrayList<>();
      for (String line : lines.subList(start + 1, lines.size())) {
        if (line.matches("  \\S.*")) {
          entries.add(line.strip());
        } else {
          entries.set(entries.size() - 1, entries.get(entries.size() - 1) + " " + line.strip());
        }
      }
      assertFalse(entries.isEmpty(), command.toString());
      for (String entry : entries) {
        assertTrue(entry.endsWith("."), command + ": a summary cut short: " + entry);
      }
    }
  }

  @Test
  void demoHelpNamesTheDemosOwnDataDirectory() {
    String text = help(List.of("demo")).text();
    int at = text.indexOf("\n      --data=DIR");
    int next = text.indexOf("\n      --", at + 1);
    String option = text.substring(at, next).replaceAll("\\s+", " ");
    assertTrue(option.contains("~/.precedent-demo"), option);
    assertFalse(option.contains("$PRECEDENT_DATA") || option.matches(".*~/\\.precedent\\b(?!-).*"),
        "the demo uses neither $PRECEDENT_DATA nor ~/.precedent: " + option);
    String other = help(List.of("ingest")).text().replaceAll("\\s+", " ");
    assertTrue(other.contains("$PRECEDENT_DATA") && other.contains("~/.precedent "), other);
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
