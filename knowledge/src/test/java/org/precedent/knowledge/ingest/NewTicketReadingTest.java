package org.precedent.knowledge.ingest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.ticket.Ticket;

/** New tickets are read by the rules resolved ones are ingested by, so both read alike. */
class NewTicketReadingTest {
  @TempDir
  Path tmp;

  private final Ingestor ingestor = new Ingestor(new DataDir(Path.of("unused")),
      TextCleaner.standard(), AnswerGrouper.standard());

  private Path write(String name, String content) throws IOException {
    return Files.writeString(tmp.resolve(name), content, StandardCharsets.UTF_8);
  }

  @Test
  void aRowReadsTheSameAsNewAndAsResolved() throws Exception {
    String question = "Hello,\n\nmy green bin was missed on Tuesday, call me on 07700 900123.\n\n"
        + "Thanks\nRiley";
    Path resolved = write("resolved.csv", "ref,text,reply,cat\nT-1,\"" + question
        + "\",We will come back,  Bins \n");
    Path fresh = write("new.csv", "ref,text,cat\nT-1,\"" + question + "\",  Bins \n");
    Ingestor.ParsedExport parsed = ingestor.parse(resolved, ExportFormat.CSV, ColumnMapping.of(
        Map.of("id", "ref", "question", "text", "reply", "reply", "category", "cat")),
        Progress.silent());
    Ticket stored = parsed.tickets().get(0);
    NewTicket asked = ingestor.readNew(fresh, ExportFormat.CSV, ColumnMapping.forNewTickets(
        Map.of("id", "ref", "question", "text", "category", "cat"))).get(0);
    assertEquals(stored.id(), asked.id());
    assertEquals(stored.question(), asked.question());
    assertEquals(stored.category(), asked.category());
    assertEquals("Bins", asked.category());
    assertTrue(!asked.question().contains("07700"), "redacted as at ingest: " + asked.question());
    assertNull(asked.problem());
  }

  @Test
  void eachBadRowGetsItsOwnProblemAndTheOthersAreRead() throws Exception {
    String big = "x".repeat(RowValidator.MAX_FIELD_CHARS + 1);
    Path file = write("new.jsonl", String.join("\n",
        "{\"ref\": \"A\", \"text\": \"my bin was missed\"}",
        "{\"ref\": \"\", \"text\": \"no id here\"}",
        "{\"ref\": \"C\", \"text\": \"\"}",
        "{\"ref\": \"D\", \"text\": \"" + big + "\"}",
        "{not json",
        "{\"ref\": \"G\", \"text\": \"when is the garden waste round\"}") + "\n");
    List<NewTicket> read = ingestor.readNew(file, ExportFormat.JSONL,
        ColumnMapping.forNewTickets(Map.of("id", "ref", "question", "text", "reply", "ignored")));
    assertEquals(6, read.size());
    assertNull(read.get(0).problem());
    assertEquals("id", read.get(1).problem().field());
    assertEquals("new.jsonl:2", read.get(1).id(), "a row without its id is named by its line");
    assertEquals("question", read.get(2).problem().field());
    assertTrue(read.get(3).problem().message().contains("over the limit"), read.get(3).toString());
    assertEquals(5, read.get(4).problem().line());
    assertNull(read.get(5).problem());
    for (NewTicket t : read) {
      assertTrue(t.problem() == null || t.problem().toString().startsWith(file.toString() + ":"),
          "the problem says where: " + t.problem());
    }
  }

  @Test
  void aResolvedMappingStillNeedsAReplyOrALabel() throws IOException {
    assertThrows(IllegalArgumentException.class,
        () -> ColumnMapping.of(Map.of("question", "text")));
    Path file = write("old.csv", "text\nmy bin\n");
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> ingestor.parse(file, ExportFormat.CSV, ColumnMapping.forNewTickets(
            Map.of("question", "text")), Progress.silent()));
    assertTrue(e.getMessage().contains("no reply column"), e.getMessage());
  }

  @Test
  void aMappingFileOfResolvedTicketsServesForNewOnes() throws IOException {
    Path mapping = write("mapping.properties", "id=ref\nsubject=subj\nbody=text\nreply=answer\n"
        + "created=opened\n");
    ColumnMapping m = ColumnMapping.newTicketsFromFile(mapping, Map.of("category", "cat"));
    assertEquals(Map.of("id", "ref", "subject", "subj", "body", "text", "category", "cat"),
        m.mapped());
    Path typo = write("typo.properties", "questoin=text\n");
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> ColumnMapping.newTicketsFromFile(typo, Map.of()));
    assertTrue(e.getMessage().contains("typo.properties") && e.getMessage().contains("questoin"),
        e.getMessage());
  }
}
