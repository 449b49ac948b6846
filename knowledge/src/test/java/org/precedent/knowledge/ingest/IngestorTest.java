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
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.retrieve.Retriever;
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
    Knowledge k = Knowledge.open(data).orElseThrow();
    try (Retriever retriever = Retriever.open(k)) {
      Ticket t = k.tickets().get("R-2");
      assertTrue(t.question().contains("\"04821\""), t.question());
      assertEquals("meters", t.category());
      assertEquals(java.time.Instant.parse("2026-03-02T09:30:00Z"), t.created());
      assertEquals(6, retriever.size());
    }
  }

  /** Three answers that each give the desk's number, and one reply with a customer's own. */
  private static String repliesWithNumbers(String deskNumber) {
    String[] answers = {
        "A crew will return within two working days to empty your bin. Questions: call %s.",
        "You can send a meter reading online at any time, or read it to us on %s.",
        "We have noted the leak and a team will visit today. For updates call %s."};
    StringBuilder csv = new StringBuilder(HEADER);
    for (int a = 0; a < answers.length; a++) {
      for (int i = 1; i <= 3; i++) {
        csv.append("A").append(a).append('-').append(i).append(",Help,\"Please help, case ")
            .append(i).append("\",\"").append(answers[a].formatted(deskNumber))
            .append("\",c").append(a).append(",2026-03-0").append(i).append("\n");
      }
    }
    // Ofcom's numbers reserved for drama (01632 960xxx, 07700 900xxx): neither is anyone's.
    csv.append("C-1,Call me,Ring me back please,\"We will ring you back on 07700 900123 today.\","
        + "c9,2026-03-04\n");
    return csv.toString();
  }

  @Test
  void aNumberInTheRepliesOfThreeGroupsIsProposedAsTheDesksOwnAndACustomersIsNot()
      throws Exception {
    IngestReport report = ingest(write("numbers.csv", repliesWithNumbers("01632 960999")));
    assertEquals(List.of(new IngestReport.ProposedDetail("phone", "01632 960999", 3, 9)),
        report.proposedOwnDetails());
    Knowledge k = Knowledge.open(data).orElseThrow();
    assertTrue(k.tickets().get("A0-1").reply().contains("[PHONE]"), "not declared yet");
  }

  @Test
  void aWebAddressInTheRepliesOfThreeGroupsIsProposedAndOnceDeclaredStays() throws Exception {
    String site = "https://www.tarnwickvale.example/help";
    IngestReport report = ingest(write("sites.csv", repliesWithNumbers(site)));
    assertEquals(List.of(new IngestReport.ProposedDetail("url", site, 3, 9)),
        report.proposedOwnDetails());
    assertTrue(Knowledge.open(data).orElseThrow().tickets().get("A0-1").reply().contains("[URL]"),
        "not declared yet");
    Files.writeString(data.ownDetails(), "url " + site + "\n");
    IngestReport again = Ingestor.of(data, AnswerGrouper.standard()).ingest(
        write("sites.csv", repliesWithNumbers(site)), ExportFormat.CSV, mapping,
        Progress.silent(), Progress.silent());
    assertEquals(List.of(), again.proposedOwnDetails());
    assertTrue(Knowledge.open(data).orElseThrow().tickets().get("A1-2").reply().contains(site));
  }

  @Test
  void aDeclaredOwnNumberStaysInAnswersAndIsNoLongerProposed() throws Exception {
    Files.createDirectories(data.root());
    Files.writeString(data.ownDetails(), "# the desk\nphone 01632-960-999\n");
    IngestReport report = Ingestor.of(data, AnswerGrouper.standard()).ingest(
        write("numbers.csv", repliesWithNumbers("01632 960999")), ExportFormat.CSV, mapping,
        Progress.silent(), Progress.silent());
    assertEquals(List.of(), report.proposedOwnDetails());
    Knowledge k = Knowledge.open(data).orElseThrow();
    assertTrue(k.tickets().get("A1-2").reply().contains("01632 960999"),
        k.tickets().get("A1-2").reply());
    assertTrue(k.tickets().get("C-1").reply().contains("[PHONE]"), "a customer's number");
    assertTrue(k.grouping().groups().stream().noneMatch(g -> g.canonical().contains("[PHONE]")));
  }

  @Test
  void aBadLineInTheOwnDetailsFileIsNamedAndNothingIsStored() throws Exception {
    Files.createDirectories(data.root());
    Files.writeString(data.ownDetails(), "phone 01632 960999\nfax 01632 960998\n");
    IOException e = assertThrows(IOException.class,
        () -> Ingestor.of(data, AnswerGrouper.standard()));
    assertTrue(e.getMessage().contains("own-details.txt:2"), e.getMessage());
    assertTrue(Knowledge.open(data).isEmpty());
  }

  @Test
  void reingestingTheSameIdsUpdatesInsteadOfDuplicating() throws Exception {
    Path file = write("good.csv", goodCsv());
    ingest(file);
    IngestReport again = ingest(file);
    assertEquals(0, again.stored());
    assertEquals(6, again.updated());
    assertEquals(6, again.totalTickets());
    Knowledge k = Knowledge.open(data).orElseThrow();
    try (Retriever retriever = Retriever.open(k)) {
      assertEquals(6, retriever.size(), "the index holds each ticket once");
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
    Knowledge k = Knowledge.open(data).orElseThrow();
    Ticket t = k.tickets().get("labelled.csv:2");
    assertEquals("how do i change my pin", t.question());
    assertEquals("pin_change", t.label());
    assertEquals("pin change", t.reply());
    assertEquals(List.of("lost_card", "pin_change").size(), k.grouping().groups().size());
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
    assertFails(latin1, ": 1 of 1 rows are not valid UTF-8 text (the first on line 2: byte 0xE9 at "
        + "byte offset 53)");
    assertFails(write("cols.csv", "ticket_id,question,answer\n1,a,b\n"),
        "line 1: the header lacks mapped column(s) subject, body, reply, category, created");
    Path junk = tmp.resolve("junk.csv");
    byte[] bytes = new byte[4096];
    new java.util.Random(1).nextBytes(bytes);
    bytes[10] = 0;
    Files.write(junk, bytes);
    assertFails(junk, "not a text export");

    assertEquals(before, data.currentGeneration().orElseThrow(), "no new generation");
    Knowledge k = Knowledge.open(data).orElseThrow();
    assertEquals(6, k.tickets().size());
  }

  @Test
  void aRepeatedIdInOneFileRejectsTheLaterRowNamingTheLineOfTheFirst() throws Exception {
    Path file = write("repeated.csv", HEADER
        + "T-1,Missed bin,\"My bin was not emptied\",\"" + MISSED + "\",bins,\n"    // line 2
        + "R-1,Meter,\"How do I send a reading?\",\"" + READING + "\",meters,\n"    // line 3
        + "T-1,Meter,\"Where do I send a reading?\",\"" + READING + "\",meters,\n"  // line 4
        + "T-1,Bin,\"bin left full\",\"" + MISSED + "\",bins,\n");                   // line 5
    IngestReport report = ingest(file);
    assertEquals(4, report.read());
    assertEquals(2, report.stored());
    assertEquals(2, report.rejected());
    assertEquals(List.of(
        file + ":4: field id: 'T-1' is already the id of line 2, which is kept; this row is not stored",
        file + ":5: field id: 'T-1' is already the id of line 2, which is kept; this row is not stored"),
        report.problems().stream().map(RowProblem::toString).toList());
    Knowledge k = Knowledge.open(data).orElseThrow();
    assertEquals("Missed bin\nMy bin was not emptied", k.tickets().get("T-1").question(),
        "the first row of the id is the one stored");
  }

  @Test
  void aRepeatedIdAfterARejectedRowKeepsTheFirstValidRow() throws Exception {
    Path file = write("repeated.csv", HEADER
        + "T-1,Missed bin,\"My bin was not emptied\",,bins,\n"                         // line 2
        + "T-1,Missed bin,\"bin left full\",\"" + MISSED + "\",bins,\n");            // line 3
    IngestReport report = ingest(file);
    assertEquals(1, report.stored());
    assertEquals(List.of(file + ":2: field reply: empty"),
        report.problems().stream().map(RowProblem::toString).toList());
  }

  /** The offset of the first byte {@code b} at or after {@code from}, found in the bytes written. */
  private static int indexOf(byte[] bytes, int b, int from) {
    for (int i = from; i < bytes.length; i++) {
      if ((bytes[i] & 0xFF) == b) {
        return i;
      }
    }
    throw new AssertionError("no byte " + b);
  }

  @Test
  void bytesThatAreNotUtf8RejectOnlyTheRowsTheyAreIn() throws Exception {
    for (String end : List.of("\n", "\r\n")) {
      String header = "ticket_id,subject,body,reply,category,created,notes" + end;
      String text = header
          + "T-1,Missed bin,\"not emptied\",\"" + MISSED + "\",bins,,x" + end            // line 2
          + "T-2,Missed bin,\"caf\u00e9 bin\",\"" + MISSED + "\",bins,,x" + end          // line 3
          + "R-1,Meter,\"two lines:" + end + "na\u00efve\",\"" + READING + "\",meters,,x" + end // 4-5
          + "R-2,Meter,\"reading?\",\"" + READING + "\",meters,,x" + end                // line 6
          + "R-3,Meter,\"reading again\",\"" + READING + "\",meters,,\u00e0 part" + end; // line 7
      // ISO-8859-1 writes each of \u00e9, \u00ef and \u00e0 as one byte that UTF-8 never allows.
      byte[] bytes = text.getBytes(StandardCharsets.ISO_8859_1);
      Path file = tmp.resolve("mixed-" + end.length() + ".csv");
      Files.write(file, bytes);
      DataDir fresh = new DataDir(tmp.resolve("data-" + end.length()));
      IngestReport report = new Ingestor(fresh, TextCleaner.standard(), AnswerGrouper.standard())
          .ingest(file, ExportFormat.CSV, mapping, Progress.silent(), Progress.silent());
      int e9 = indexOf(bytes, 0xE9, 0);
      int ef = indexOf(bytes, 0xEF, 0);
      assertEquals(List.of(
          String.format(java.util.Locale.ROOT, "%s:3: field body: not valid UTF-8 text: byte 0xE9 at "
              + "byte offset %,d; export the file as UTF-8", file, e9),
          String.format(java.util.Locale.ROOT, "%s:4: field body: not valid UTF-8 text: byte 0xEF at "
              + "byte offset %,d (line 5); export the file as UTF-8", file, ef)),
          report.problems().stream().map(RowProblem::toString).toList(), "line ends " + end.length());
      assertEquals(5, report.read());
      assertEquals(3, report.stored(), "the other rows go in; a bad byte in an unmapped column is "
          + "not stored and does not matter");
      Knowledge k = Knowledge.open(fresh).orElseThrow();
      assertEquals(java.util.Set.of("T-1", "R-2", "R-3"), k.tickets().keySet());
    }
  }

  @Test
  void aJsonLineWithBytesThatAreNotUtf8IsRejectedAlone() throws Exception {
    String text = """
        {"ticket_id": "J-1", "subject": "Missed bin", "body": "not emptied", "reply": "%s"}
        {"ticket_id": "J-2", "subject": "Missed bin", "body": "caf\u00e9", "reply": "%s"}
        {"ticket_id": "J-3", "subject": "Meter", "body": "reading?", "reply": "%s"}
        """.formatted(MISSED, MISSED, READING);
    byte[] bytes = text.getBytes(StandardCharsets.ISO_8859_1);
    Path file = tmp.resolve("tickets.jsonl");
    Files.write(file, bytes);
    IngestReport report = ingest(file);
    assertEquals(2, report.stored());
    assertEquals(List.of(file + ":2: field body: not valid UTF-8 text: byte 0xE9 at byte offset "
        + indexOf(bytes, 0xE9, 0) + "; export the file as UTF-8"),
        report.problems().stream().map(RowProblem::toString).toList());
  }

  @Test
  void aFileMostlyNotUtf8IsRefusedAsAWhole() throws Exception {
    ingest(write("good.csv", goodCsv()));
    Path before = data.currentGeneration().orElseThrow();
    String text = HEADER
        + "T-1,Caf\u00e9,\"bin\",\"" + MISSED + "\",bins,\n"
        + "T-2,Missed bin,\"not emptied\",\"" + MISSED + "\",bins,\n"
        + "T-3,Missed bin,\"na\u00efve\",\"" + MISSED + "\",bins,\n";
    byte[] bytes = text.getBytes(StandardCharsets.ISO_8859_1);
    Path file = tmp.resolve("latin1.csv");
    Files.write(file, bytes);
    assertFails(file, ": 2 of 3 rows are not valid UTF-8 text (the first on line 2: byte 0xE9 at "
        + "byte offset " + indexOf(bytes, 0xE9, 0) + "): the file is in another encoding; export it "
        + "as UTF-8");
    assertEquals(before, data.currentGeneration().orElseThrow(), "nothing stored");
  }

  @Test
  void aQuoteNeverClosedNamesTheLineWhereItOpened() throws Exception {
    Path file = write("unclosed.csv", HEADER
        + "T-1,Missed bin,\"two\nlines\",\"" + MISSED + "\",bins,\n"          // lines 2-3
        + "T-2,Missed bin,\"not emptied,A crew will call.,bins,\n"              // line 4
        + "T-3,Missed bin,bin left full,A crew will call.,bins,\n");             // line 5
    assertFails(file, ": line 4: a quoted field opened here is never closed (a closing \" is "
        + "missing, so the rest of the file would be read as this one field)");
  }

  @Test
  void aQuotedFieldThatGoesOnAfterItsClosingQuoteNamesItsLine() throws Exception {
    Path file = write("quote.csv", HEADER
        + "T-1,Missed bin,\"two\nlines\",\"" + MISSED + "\",bins,\n"          // lines 2-3
        + "T-2,Missed bin,\"the \"bin\" was full\",\"" + MISSED + "\",bins,\n");  // line 4
    assertFails(file, ": line 4: a quoted field is closed and then goes on before the next comma "
        + "(inside a quoted field, write a \" as \"\")");
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
    Knowledge k = Knowledge.open(data).orElseThrow();
    try (Retriever retriever = Retriever.open(k)) {
      assertEquals(current, k.generation(), "the old generation still serves");
      assertEquals(6, retriever.size());
    }
    ingest(write("more.csv", HEADER + "N-1,Missed bin,\"bin not emptied\",\"" + MISSED + "\",bins,\n"));
    assertFalse(Files.exists(partial), "the next change removes what the crash left");
    assertEquals(7, Knowledge.open(data).orElseThrow().tickets().size());
  }

  private void assertFails(Path file, String expected) {
    IngestException e = assertThrows(IngestException.class, () -> ingest(file));
    assertTrue(e.getMessage().contains(expected), e.getMessage());
    assertTrue(e.getMessage().startsWith(file.toString()), "names the file: " + e.getMessage());
    assertFalse(e.getMessage().contains("\n"), "one line: " + e.getMessage());
  }
}
