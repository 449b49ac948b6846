package org.precedent.knowledge.datasets;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.ticket.Ticket;

class Clinc150Test {

  @Test
  void theSplitsHaveThePublishedSizes() throws IOException {
    // Larson et al. 2019, section 3: 150 intents in 10 domains, 100 train, 20 validation and 30
    // test queries per intent; out-of-scope 100 train, 100 validation, 1,000 test ("full" version).
    Clinc150 clinc = Clinc150.load();
    assertEquals(10, clinc.domains().size());
    assertEquals(150, clinc.allIntents().size());
    assertEquals(15, clinc.intents("banking").size());
    assertEquals(15_000, clinc.split("train", clinc.allIntents()).size());
    assertEquals(3_000, clinc.split("val", clinc.allIntents()).size());
    assertEquals(4_500, clinc.split("test", clinc.allIntents()).size());
    assertEquals(100, clinc.split("oos_val", null).size());
    assertEquals(1_000, clinc.split("oos_test", null).size());
    assertEquals(450, clinc.split("test", clinc.intents("banking")).size());
  }

  @Test
  void examplesBecomeLabelledTicketsAsIngestMakesThem() throws IOException {
    Clinc150 clinc = Clinc150.load();
    List<Ticket> tickets = Clinc150.tickets(
        clinc.split("train", clinc.intents("banking")).subList(0, 3), "train", TextCleaner.standard());
    assertEquals("train-0", tickets.get(0).id());
    for (Ticket t : tickets) {
      assertTrue(clinc.intents("banking").contains(t.label()), t.label());
      assertEquals(t.label().replace('_', ' '), t.reply());
      assertTrue(!t.question().isBlank());
    }
  }

  @Test
  void aMissingFolderOrFileOrDomainIsNamed(@TempDir Path tmp) throws IOException {
    IOException missing = assertThrows(IOException.class, () -> Clinc150.load(tmp));
    assertTrue(missing.getMessage().contains("clinc150" + java.io.File.separator + "data_full.json"),
        missing.getMessage());
    Files.createDirectories(tmp.resolve("clinc150"));
    Files.writeString(tmp.resolve("clinc150/data_full.json"), "[1, 2]");
    Files.writeString(tmp.resolve("clinc150/domains.json"), "{}");
    IOException notObject = assertThrows(IOException.class, () -> Clinc150.load(tmp));
    assertTrue(notObject.getMessage().contains("data_full.json"), notObject.getMessage());
    IllegalArgumentException domain = assertThrows(IllegalArgumentException.class,
        () -> Clinc150.load().intents("bankin"));
    assertTrue(domain.getMessage().contains("'bankin'") && domain.getMessage().contains("banking"),
        domain.getMessage());
  }
}
