package org.precedent.engine.decide;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** A template's slots filled from a ticket's fields only when every one of them can be. */
class SlotFieldsTest {
  static final String TEMPLATE = "Your bin collection day is ⟦slot:day⟧; your reference is "
      + "⟦slot:number⟧.";

  @TempDir
  Path tmp;

  private SlotFields read(String text) throws IOException {
    Path file = tmp.resolve("slot-fields.properties");
    Files.writeString(file, text, StandardCharsets.UTF_8);
    return SlotFields.read(file);
  }

  @Test
  void everySlotFilledOrNone() throws IOException {
    SlotFields map = read("# from the ticket system\nday = collection_day\nnumber=case.ref\n");
    assertEquals(Optional.of("Your bin collection day is Tuesday; your reference is C-1234."),
        map.fill(TEMPLATE, Map.of("collection_day", " Tuesday ", "case.ref", "C-1234")));
    // One slot without its field, blank, or not sendable as it stands: a person fills them in.
    assertEquals(Optional.empty(), map.fill(TEMPLATE, Map.of("collection_day", "Tuesday")));
    assertEquals(Optional.empty(), map.fill(TEMPLATE, Map.of("collection_day", "Tuesday",
        "case.ref", "  ")));
    assertEquals(Optional.empty(), map.fill(TEMPLATE, Map.of("collection_day", "Tuesday",
        "case.ref", "[ACCOUNT]")), "a redacted value");
    assertEquals(Optional.empty(), map.fill(TEMPLATE, Map.of("collection_day", "Tue\nday",
        "case.ref", "C-1")), "a line break");
    assertEquals(Optional.empty(), map.fill(TEMPLATE, Map.of("collection_day", "x".repeat(201),
        "case.ref", "C-1")));
    assertEquals(Optional.empty(), map.fill(TEMPLATE, Map.of("collection_day", "⟦slot:day⟧",
        "case.ref", "C-1")));
    assertEquals(Optional.empty(), read("day = collection_day\n").fill(TEMPLATE,
        Map.of("collection_day", "Tuesday", "case.ref", "C-1")), "a slot with no field named");
    assertEquals(Optional.empty(), map.fill("No slots here.", Map.of("collection_day", "Tue")));
  }

  @Test
  void aMissingFileMapsNothingAndABadLineIsRefusedNamingFileAndLine() throws IOException {
    assertSame(SlotFields.NONE, SlotFields.read(tmp.resolve("absent.properties")));
    IOException e = assertThrows(IOException.class, () -> read("day = collection_day\nday\n"));
    assertTrue(e.getMessage().endsWith("slot-fields.properties:2: expected 'slot = field', got "
        + "'day'"), e.getMessage());
    e = assertThrows(IOException.class, () -> read("Day = collection_day\n"));
    assertTrue(e.getMessage().contains(":1: slot 'Day' is not a slot name"), e.getMessage());
    e = assertThrows(IOException.class, () -> read("day = collection day\n"));
    assertTrue(e.getMessage().contains(":1: field 'collection day' is not a field name"),
        e.getMessage());
    e = assertThrows(IOException.class, () -> read("day = a\n\nday = b\n"));
    assertTrue(e.getMessage().contains(":3: slot 'day' is mapped already, to 'a'"),
        e.getMessage());
  }
}
