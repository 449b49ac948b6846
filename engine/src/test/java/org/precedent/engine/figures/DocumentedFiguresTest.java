package org.precedent.engine.figures;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

/**
 * DEVELOPERS.md shows exactly the figures of docs/expected-metrics.json: a figure edited by hand in
 * either file, or an expected-figures file recorded without writing the document, fails here.
 * {@code ./precedent benchmark figures --update-docs} puts them back in step.
 */
class DocumentedFiguresTest {
  @Test
  void developersMdShowsTheExpectedFigures() throws Exception {
    Path root = root();
    ExpectedFigures expected = ExpectedFigures.load(root.resolve("docs").resolve("expected-metrics.json"));
    Path doc = root.resolve("DEVELOPERS.md");
    String text = Files.readString(doc, StandardCharsets.UTF_8);
    assertTrue(FigureDocs.markers(text) >= 30, "DEVELOPERS.md lost its figure markers");
    String[] want = FigureDocs.regenerate(text, expected, doc.toString()).split("\n", -1);
    String[] have = text.split("\n", -1);
    for (int i = 0; i < have.length; i++) {
      assertEquals(want[i], have[i], "DEVELOPERS.md:" + (i + 1) + " differs from docs/expected-metrics.json:"
          + " run ./precedent benchmark figures --update-docs");
    }
  }

  private static Path root() {
    String root = System.getProperty("precedent.root");
    return root != null ? Path.of(root) : Path.of("..").toAbsolutePath().normalize();
  }
}
