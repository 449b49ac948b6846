package org.precedent.engine.figures;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ExpectedFiguresTest {
  private static final String FILE = """
      {
        "about": "demo figures",
        "measuredWith": {"computeThreads": "1 thread"},
        "figures": [
          {"name": "fused.top1", "label": "fused top-1", "expected": 0.985, "tolerance": 0.002, "format": "0.000"},
          {"name": "bm25.threshold", "expected": null, "tolerance": 0},
          {"name": "training.pairs", "expected": 2316, "tolerance": 0, "format": "#,##0"}
        ]
      }
      """;

  @Test
  void readsFiguresWithTheirDefaults(@TempDir Path dir) throws IOException {
    ExpectedFigures f = ExpectedFigures.load(Files.writeString(dir.resolve("e.json"), FILE));
    assertEquals("demo figures", f.about());
    assertEquals(Map.of("computeThreads", "1 thread"), f.measuredWith());
    assertEquals(List.of("fused.top1", "bm25.threshold", "training.pairs"),
        f.figures().stream().map(ExpectedFigures.Figure::name).toList());
    ExpectedFigures.Figure none = f.figure("bm25.threshold").orElseThrow();
    assertNull(none.expected());
    assertEquals("bm25.threshold", none.label(), "the label defaults to the name");
    assertEquals("0.000", none.format(), "the format defaults to three decimals");
    assertEquals(2316.0, f.figure("training.pairs").orElseThrow().expected());
  }

  @Test
  void savedFileReadsBackTheSame(@TempDir Path dir) throws IOException {
    ExpectedFigures f = ExpectedFigures.load(Files.writeString(dir.resolve("e.json"), FILE));
    Path again = dir.resolve("again.json");
    f.save(again);
    assertEquals(f, ExpectedFigures.load(again));
  }

  @Test
  void recordingKeepsNamesTolerancesAndFormatsAndTakesTheMeasuredValues(@TempDir Path dir)
      throws IOException {
    ExpectedFigures f = ExpectedFigures.load(Files.writeString(dir.resolve("e.json"), FILE));
    Map<String, Double> measured = new LinkedHashMap<>();
    measured.put("fused.top1", 0.9852398523985239);
    measured.put("bm25.threshold", 0.91);
    measured.put("not.listed", 3.0);
    ExpectedFigures r = f.recorded(measured, Map.of("date", "today"));
    assertEquals(Map.of("date", "today"), r.measuredWith());
    assertEquals(0.9852398523985239, r.figure("fused.top1").orElseThrow().expected());
    assertEquals(0.002, r.figure("fused.top1").orElseThrow().tolerance());
    assertEquals(0.91, r.figure("bm25.threshold").orElseThrow().expected());
    assertEquals(2316.0, r.figure("training.pairs").orElseThrow().expected(), "not measured: kept");
    assertTrue(r.figure("not.listed").isEmpty(), "the file, not the run, decides what is tracked");
    assertNull(f.recorded(Map.of("fused.top1", Double.NaN), Map.of()).figure("fused.top1")
        .orElseThrow().expected(), "an undefined measurement is recorded as null");
  }

  @Test
  void aBadFileIsRefusedNamingTheFileAndTheFigure(@TempDir Path dir) throws IOException {
    Path file = dir.resolve("bad.json");
    Files.writeString(file, FILE.replace("\"tolerance\": 0.002", "\"tolerance\": -1"));
    IOException negative = assertThrows(IOException.class, () -> ExpectedFigures.load(file));
    assertTrue(negative.getMessage().startsWith(file + ": figures[0]: figure fused.top1: tolerance"),
        negative.getMessage());

    Files.writeString(file, FILE.replace("\"expected\": 2316", "\"expected\": \"2316\""));
    IOException text = assertThrows(IOException.class, () -> ExpectedFigures.load(file));
    assertTrue(text.getMessage().contains("figures[2]: figure training.pairs: 'expected' must be a number"), text.getMessage());

    Files.writeString(file, FILE.replace("bm25.threshold", "fused.top1"));
    IOException twice = assertThrows(IOException.class, () -> ExpectedFigures.load(file));
    assertTrue(twice.getMessage().contains("fused.top1 is listed twice"), twice.getMessage());

    Files.writeString(file, FILE.replace("\"#,##0\"", "\"0.0.0\""));
    IOException pattern = assertThrows(IOException.class, () -> ExpectedFigures.load(file));
    assertTrue(pattern.getMessage().contains("not a decimal format pattern"), pattern.getMessage());

    Files.writeString(file, "{\"figures\": [");
    IOException broken = assertThrows(IOException.class, () -> ExpectedFigures.load(file));
    assertTrue(broken.getMessage().startsWith(file + ": not valid JSON (line 1)"), broken.getMessage());
  }
}
