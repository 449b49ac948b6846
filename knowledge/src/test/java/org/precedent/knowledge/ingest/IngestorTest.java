package org.precedent.knowledge.ingest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.progress.Progress;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;
import org.precedent.knowledge.ticket.Ticket;

class IngestorTest {
  @TempDir
  Path tmp;

  private DataDir data;
  private Ingestor ingestor;
  private final ColumnMapping mapping = ColumnMapping.of(Map.of(
      "id", "ticket_id", "subject", "subject", "body", "body", "reply", "reply",
      "category", "category", "created", "created"));

  private static final String HEADER = "ticket_id,subject,body,reply,category,created\n";
  private static final String MISSED = "A crew will return within two working days to empty your "
      + "bin. Please leave it at the kerb until then.";
  private static final String READING = "You can send a meter reading online at any time; we "
      + "revise the bill within five working days.";

  @BeforeEach
  void setUp() {
    data = new DataDir(tmp.resolve("data"));
    ingestor = new Ingestor(data, TextCleaner.standard(), AnswerGrouper.standard());
  }

  private Path write(String name, String content) throws IOException {
    Path file = tmp.resolve(name);
    Files.writeString(file, content, StandardCharsets.UTF_8);
    return file;
  }

  private IngestReport ingest(Path file) throws Exception {
    return ingestor.ingest(file, ExportFormat.of(file), mapping, Progress.silent(),
        Progress.silent());
  }

  private static String goodCsv() {
    StringBuilder csv = new StringBuilder(HEADER);
    for (int i = 1; i <= 3; i++) {
      csv.append("T-").append(i).append(",Missed bin,\"My bin was not emptied, street ").append(i)
          .append("\",\"").append(MISSED).append("\",bins,2026-03-0").append(i).append("\n");
      csv.append("R-").append(i).append(",Meter,\"How do I send a reading? It is \"\"04821\"\"\",")
          .append('"').append(READING).append("\",meters,2026-03-0").append(i)
          .append("T09:30:00Z\n");
    }
    return csv.toString();
  }

  @Test
  void storesValidTicketsAndReportsCountsAndGroups() throws Exception {
    IngestReport report = ingest(write("good.csv", goodCsv()));
    assertEquals(6, report.read());
    assertEquals(6, report.stored());
    assertEquals(0, report.updated());
    assertEquals(0, report.rejected());
    assertEquals(2, report.groupSizes().size());
    try (Knowledge k = Knowledge.open(data).orElseThrow()) {
      Ticket t = k.tickets().get("R-2");
      assertTrue(t.question().contains("\"04821\""), t.question());
      assertEquals("meters", t.category());
      assertEquals(java.time.Instant.parse("2026-03-02T09:30:00Z"), t.created());
      assertEquals(6, k.retriever().size());
    }
  }

  @Test
  void reingestingTheSameIdsUpdatesInsteadOfDuplicating() throws Exception {
    Path file = write("good.csv", goodCsv());
    ingest(file);
    IngestReport again = ingest(file);
    assertEquals(0, again.stored());
    assertEquals(6, again.updated());
    assertEquals(6, again.totalTickets());
    try (Knowledge k = Knowledge.open(data).orElseThrow()) {
      assertEquals(6, k.retriever().size(), "the index holds each ticket once");
    }
  }

  @Test
  void badRowsAreReportedWithFileLineAndFieldAndGoodRowsStillGoIn() throws Exception {
    String csv = goodCsv()
        + "B-1,Bad,\"no reply here\",,bins,2026-03-01\n"          // line 8: reply empty
        + "B-2,Bad,\"when?\",\"" + MISSED + "\",bins,yesterday\n"   // line 9: created unparseable
        + ",,,\"" + MISSED + "\",bins,\n"                           // line 10: no id, no question
        + "B-4,only,three\n";                                        // line 11: too few fields
    Path file = write("mixed.csv", csv);
    IngestReport report = ingest(file);
    assertEquals(10, report.read());
    assertEquals(6, report.stored());
    assertEquals(4, report.rejected());
    List<String> problems = report.problems().stream().map(RowProblem::toString).toList();
    assertTrue(problems.contains(file + ":8: field reply: empty"), problems.toString());
    assertTrue(problems.stream().anyMatch(p -> p.startsWith(file + ":9: field created: 'yesterday'")),
        problems.toString());
    assertTrue(problems.contains(file + ":10: field id: empty"), problems.toString());
    assertTrue(problems.contains(file + ":10: field subject/body: empty"), problems.toString());
    assertTrue(problems.contains(file + ":11: has 3 fields, the header has 6"), problems.toString());
  }

  @Test
  void readsJsonLinesWithBadLinesReported() throws Exception {
    Path file = write("tickets.jsonl", """
        {"ticket_id": "J-1", "subject": "Missed bin", "body": "not emptied", "reply": "%s"}
        {"ticket_id": "J-2", "subject": "Missed bin", "body": "bin left full", "reply": "%s"}
        this is not json
        {"ticket_id": "J-3", "subject": ["a"], "body": "x", "reply": "y"}

        {"ticket_id": "J-4", "subject": "Meter", "body": "reading?", "reply": "%s"}
        """.formatted(MISSED, MISSED, READING));
    IngestReport report = ingest(file);
    assertEquals(5, report.read(), "blank lines are not records");
    assertEquals(3, report.stored());
    assertEquals(List.of(3L, 4L), report.problems().stream().map(RowProblem::line).toList());
  }

  @Test
  void aLabelledTextFileUsesTheLabelAsGroupAndReply() throws Exception {
    Path file = write("labelled.csv", "text,category\nhow do i change my pin,pin_change\n"
        + "i forgot my pin,pin_change\nmy card was stolen,lost_card\n");
    IngestReport report = ingestor.ingest(file, ExportFormat.CSV,
        ColumnMapping.of(Map.of("question", "text", "label", "category")), Progress.silent(),
        Progress.silent());
    assertEquals(3, report.stored());
    try (Knowledge k = Knowledge.open(data).orElseThrow()) {
      Ticket t = k.tickets().get("labelled.csv:2");
      assertEquals("how do i change my pin", t.question());
      assertEquals("pin_change", t.label());
      assertEquals("pin change", t.reply());
      assertEquals(List.of("lost_card", "pin_change").size(), k.grouping().groups().size());
    }
  }

  @Test
  void badFilesFailWithOneLineAndLeaveTheStoreAsItWas() throws Exception {
    ingest(write("good.csv", goodCsv()));
    Path before = data.currentGeneration().orElseThrow();

    assertFails(tmp.resolve("absent.csv"), "no such file");
    assertFails(write("empty.csv", ""), "the file is empty");
    Path latin1 = tmp.resolve("latin1.csv");
    Files.write(latin1, (HEADER + "T-9,Caf\u00e9,\"na\u00efve\",\"" + MISSED + "\",bins,\n")
        .getBytes(StandardCharsets.ISO_8859_1));
    assertFails(latin1, ": line 2 (byte 54): not valid UTF-8");
    assertFails(write("cols.csv", "ticket_id,question,answer\n1,a,b\n"),
        "line 1: the header lacks mapped column(s) subject, body, reply, category, created");
    Path junk = tmp.resolve("junk.csv");
    byte[] bytes = new byte[4096];
    new java.util.Random(1).nextBytes(bytes);
    bytes[10] = 0;
    Files.write(junk, bytes);
    assertFails(junk, "not a text export");

    assertEquals(before, data.currentGeneration().orElseThrow(), "no new generation");
    try (Knowledge k = Knowledge.open(data).orElseThrow()) {
      assertEquals(6, k.tickets().size());
    }
  }

  @Test
  void aTenMegabyteFieldRejectsItsRowOnly() throws Exception {
    String huge = "x".repeat(10 * 1024 * 1024);
    Path file = write("huge.csv", goodCsv() + "H-1,Big,\"" + huge + "\",\"" + MISSED + "\",bins,\n");
    IngestReport report = ingest(file);
    assertEquals(6, report.stored());
    assertEquals(1, report.rejected());
    assertEquals("field body: 10,485,760 characters, over the limit of 100,000",
        report.problems().get(0).toString().replace(file + ":8: ", ""));
  }

  @Test
  void anUnfinishedGenerationLeftByACrashIsIgnoredAndCleanedUp() throws Exception {
    ingest(write("good.csv", goodCsv()));
    Path current = data.currentGeneration().orElseThrow();
    // What a crash in the middle of a rebuild leaves: a newer generation with a partial index.
    Path partial = data.knowledge().resolve("gen-000099");
    Files.createDirectories(partial.resolve("index"));
    Files.writeString(partial.resolve("index").resolve("_0.cfs"), "half");
    try (Knowledge k = Knowledge.open(data).orElseThrow()) {
      assertEquals(current, k.generation(), "the old generation still serves");
      assertEquals(6, k.retriever().size());
    }
    ingest(write("more.csv", HEADER + "N-1,Missed bin,\"bin not emptied\",\"" + MISSED + "\",bins,\n"));
    assertFalse(Files.exists(partial), "the next change removes what the crash left");
    try (Knowledge k = Knowledge.open(data).orElseThrow()) {
      assertEquals(7, k.tickets().size());
    }
  }

  private void assertFails(Path file, String expected) {
    IngestException e = assertThrows(IngestException.class, () -> ingest(file));
    assertTrue(e.getMessage().contains(expected), e.getMessage());
    assertTrue(e.getMessage().startsWith(file.toString()), "names the file: " + e.getMessage());
    assertFalse(e.getMessage().contains("\n"), "one line: " + e.getMessage());
  }
}
