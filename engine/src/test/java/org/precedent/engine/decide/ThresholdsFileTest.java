package org.precedent.engine.decide;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.knowledge.store.DataDir;

/** {@code thresholds.properties}: what is written reads back the same, and a bad file says where. */
class ThresholdsFileTest {
  @TempDir
  Path tmp;

  /** Names a help desk may well use, each awkward for a properties file in its own way. */
  static final List<String> AWKWARD = List.of("green bins", "Água e esgoto", "Straße",
      "請求書", "rate=band", "billing: arrears", "#urgent", "!important", "C:\\shares\\billing",
      "a\\u12", "trailing\\", "no-break\u00a0space", "emoji 🚰 leak", "x = y : z # w",
      "é", "ß", "=", "\\");

  @Test
  void everyAcceptedNameReadsBackTheSame() throws IOException {
    DataDir dir = new DataDir(tmp);
    Map<String, Double> perCategory = new LinkedHashMap<>();
    double v = 0.5;
    for (String name : AWKWARD) {
      perCategory.put(name, v);
      v += 0.01;
    }
    Thresholds written = new Thresholds(0.8125, perCategory);
    InForce.writeThresholds(dir, written);
    Thresholds read = InForce.readThresholds(dir);
    assertEquals(written.global(), read.global(), 1e-12);
    assertEquals(written.perCategory().keySet(), read.perCategory().keySet());
    written.perCategory().forEach((name, value) ->
        assertEquals(value, read.perCategory().get(name), 1e-4, name));
  }

  @Test
  void namesThatCouldNeverMatchATicketAreRefused() {
    // Control and format characters, line breaks, unpaired surrogates, and spaces at either end
    // (ticket categories are stripped on ingest and on every question).
    for (String bad : List.of("", " ", " bins", "bins ", "line\nbreak", "tab\tbed", "zero\u200bwidth",
        "bidi\u202eflip", "half\ud800", "nul\u0000")) {
      Optional<String> problem = Thresholds.categoryProblem(bad);
      assertTrue(problem.isPresent(), "'" + bad + "' should be refused");
    }
    assertThrows(IllegalArgumentException.class,
        () -> new Thresholds(0.5, Map.of("line\nbreak", 0.5)));
  }

  @Test
  void aCategoryFindsItsThresholdWhateverItsCaseOrSpacing() {
    Thresholds t = new Thresholds(0.9, Map.of("Billing", 0.97));
    assertEquals(0.97, t.forCategory("billing"));
    assertEquals(0.97, t.forCategory(" BILLING "));
    assertEquals(Optional.of("Billing"), t.own("billing"));
    assertEquals(0.9, t.forCategory("bins"));
    assertEquals(0.9, t.forCategory(null));
    assertEquals(Optional.empty(), t.own(null));
  }

  @Test
  void twoThresholdsForOneCategoryInDifferentCaseAreRefused() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> new Thresholds(0.9, Map.of("Billing", 0.97, "billing", 0.8)));
    assertTrue(e.getMessage().contains("differ only in case"), e.getMessage());
  }

  @Test
  void aMalformedFileNamesItselfAndTheLine() throws IOException {
    DataDir dir = new DataDir(tmp);
    Path file = tmp.resolve("thresholds.properties");
    // What an earlier release wrote for the category a-backslash-u-1-2: a broken escape.
    Files.writeString(file, "# Confidence needed for an automatic reply.\nglobal=0.9000\n"
        + "category.a\\u12=0.5000\n");
    IOException e = assertThrows(IOException.class, () -> InForce.readThresholds(dir));
    assertTrue(e.getMessage().contains(file.toString()), e.getMessage());
    assertTrue(e.getMessage().contains("line 3"), e.getMessage());
    assertTrue(e.getMessage().contains("\\uxxxx"), e.getMessage());
  }

  @Test
  void aValueThatIsNoNumberNamesTheKey() throws IOException {
    DataDir dir = new DataDir(tmp);
    Path file = tmp.resolve("thresholds.properties");
    Files.writeString(file, "global=0.9\ncategory.bins=high\n");
    IOException e = assertThrows(IOException.class, () -> InForce.readThresholds(dir));
    assertTrue(e.getMessage().contains(file.toString()), e.getMessage());
    assertTrue(e.getMessage().contains("category.bins"), e.getMessage());
    assertTrue(e.getMessage().contains("'high'"), e.getMessage());
  }
}
