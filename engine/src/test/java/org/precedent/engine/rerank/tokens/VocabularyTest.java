package org.precedent.engine.rerank.tokens;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class VocabularyTest {

  private final List<List<String>> texts = List.of(
      List.of("card", "blocked", "card", "pin"),
      List.of("card", "pin", "refund", "rare"));

  @Test
  void reservesTheFirstIdsAndOrdersByCountThenAlphabet() {
    Vocabulary v = Vocabulary.build(texts, 100, 1);
    assertEquals(List.of("<pad>", "<unk>", "<s>", "</s>", "card", "pin", "blocked", "rare", "refund"),
        List.of(v.token(0), v.token(1), v.token(2), v.token(3), v.token(4), v.token(5), v.token(6), v.token(7),
            v.token(8)));
    assertEquals(Vocabulary.PAD_ID, v.id("<pad>"));
    assertEquals(Vocabulary.UNK_ID, v.id("never seen"));
  }

  @Test
  void capAndMinimumCountLeaveOutRareTokens() {
    Vocabulary capped = Vocabulary.build(texts, 6, 1);
    assertEquals(6, capped.size());
    assertEquals(Vocabulary.UNK_ID, capped.id("blocked"));
    Vocabulary frequent = Vocabulary.build(texts, 100, 2);
    assertEquals(List.of(4, 5), List.of(frequent.id("card"), frequent.id("pin")));
    assertEquals(6, frequent.size());
  }

  @Test
  void savesAndLoadsTheSameList(@TempDir Path dir) throws IOException {
    Vocabulary v = Vocabulary.build(texts, 100, 1);
    Path file = dir.resolve("vocab.txt");
    v.save(file);
    assertEquals(v, Vocabulary.load(file));
  }

  @Test
  void truncatedOrEditedFileIsRefused(@TempDir Path dir) throws IOException {
    Path file = dir.resolve("vocab.txt");
    Vocabulary.build(texts, 100, 1).save(file);
    List<String> lines = Files.readAllLines(file, StandardCharsets.UTF_8);

    Files.write(file, lines.subList(0, lines.size() - 2), StandardCharsets.UTF_8);
    IOException cut = assertThrows(IOException.class, () -> Vocabulary.load(file));
    assertTrue(cut.getMessage().contains("truncated"), cut.getMessage());

    List<String> edited = new java.util.ArrayList<>(lines);
    edited.set(5, "kard");
    Files.write(file, edited, StandardCharsets.UTF_8);
    IOException changed = assertThrows(IOException.class, () -> Vocabulary.load(file));
    assertTrue(changed.getMessage().contains("checksum"), changed.getMessage());
  }
}
