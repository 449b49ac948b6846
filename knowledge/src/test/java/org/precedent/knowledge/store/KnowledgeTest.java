package org.precedent.knowledge.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.knowledge.group.Grouping;
import org.precedent.knowledge.ticket.Ticket;

/** The store writes a generation around an index it is given, without knowing what is in it. */
class KnowledgeTest {
  private static final List<Ticket> TICKETS = List.of(
      new Ticket("T-1", "my bin was not emptied", "A crew will come back.", null, "bins", null),
      new Ticket("T-2", "the lid of my bin is broken", "A new lid is on its way.", null, "bins", null));
  private static final Grouping ONE_OFFS = new Grouping(List.of(), List.of("T-1", "T-2"), "test");

  @Test
  void theIndexIsWrittenIntoTheGenerationBeforeItsManifest(@TempDir Path tmp) throws Exception {
    DataDir dir = new DataDir(tmp);
    Knowledge.replace(dir, TICKETS, ONE_OFFS, List.of("a.csv"), (index, tickets, grouping) -> {
      // The layout of DEVELOPERS.md: DIR/knowledge/gen-NNNNNN/index/, empty when handed over, and
      // manifest.json (the mark of a finished generation) not yet written.
      assertEquals(dir.knowledge().resolve("gen-000001").resolve("index"), index);
      try (var files = Files.list(index)) {
        assertEquals(0, files.count());
      }
      assertFalse(Files.exists(index.resolveSibling("manifest.json")));
      assertEquals(TICKETS, tickets);
      assertEquals(ONE_OFFS, grouping);
      Files.writeString(index.resolve("segments"), "2 tickets");
      return new Manifest.Vectors("an encoder", "ab12", 3);
    });
    Knowledge k = Knowledge.open(dir).orElseThrow();
    assertEquals(dir.knowledge().resolve("gen-000001"), k.generation());
    assertEquals("2 tickets", Files.readString(k.indexDirectory().resolve("segments")));
    assertEquals(List.of("T-1", "T-2"), List.copyOf(k.tickets().keySet()));
    assertEquals(2, k.manifest().tickets());
    // What the builder says made the vectors is in the manifest.
    assertEquals(new Manifest.Vectors("an encoder", "ab12", 3), k.manifest().vectors());
  }

  @Test
  void anIndexThatFailsLeavesThePreviousGenerationInForce(@TempDir Path tmp) throws Exception {
    DataDir dir = new DataDir(tmp);
    Knowledge.replace(dir, TICKETS.subList(0, 1), new Grouping(List.of(), List.of("T-1"), "test"),
        List.of("a.csv"), (index, tickets, grouping) -> null);
    IOException e = assertThrows(IOException.class, () -> Knowledge.replace(dir, TICKETS, ONE_OFFS,
        List.of("a.csv", "b.csv"), (index, tickets, grouping) -> {
          throw new IOException("disk full while indexing");
        }));
    assertEquals("disk full while indexing", e.getMessage());
    Knowledge k = Knowledge.open(dir).orElseThrow();
    assertEquals(dir.knowledge().resolve("gen-000001"), k.generation());
    assertEquals(1, k.tickets().size());
    assertTrue(Files.notExists(dir.knowledge().resolve("gen-000002")), "the unfinished generation is removed");
  }

  /**
   * The tickets are read when first asked for, not at the opening: a damaged line then names the
   * file and the line, and a generation whose tickets file is gone is refused at the opening.
   */
  @Test
  void aDamagedTicketsFileNamesItsLineWhenTheTicketsAreRead(@TempDir Path tmp) throws Exception {
    DataDir dir = new DataDir(tmp);
    Knowledge.replace(dir, TICKETS, ONE_OFFS, List.of("a.csv"), (index, tickets, grouping) -> null);
    Path file = dir.knowledge().resolve("gen-000001").resolve("tickets.jsonl");
    List<String> lines = Files.readAllLines(file);
    Files.write(file, List.of(lines.get(0), "{\"id\": \"T-2\", \"question\": "));
    Knowledge k = Knowledge.open(dir).orElseThrow();
    java.io.UncheckedIOException e = assertThrows(java.io.UncheckedIOException.class, k::tickets);
    assertTrue(e.getMessage().startsWith(file + ":2: not a stored ticket"), e.getMessage());

    Files.delete(file);
    IOException gone = assertThrows(IOException.class, () -> Knowledge.open(dir));
    assertTrue(gone.getMessage().contains(file + ": missing"), gone.getMessage());
  }
}
