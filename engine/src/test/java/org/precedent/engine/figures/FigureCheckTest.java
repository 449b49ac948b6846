package org.precedent.engine.figures;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Comparing measured figures with expected ones, worked out by hand. */
class FigureCheckTest {
  private static ExpectedFigures.Figure figure(String name, Double expected, double tolerance) {
    return new ExpectedFigures.Figure(name, null, expected, tolerance, null);
  }

  @Test
  void aFigurePassesWithinItsToleranceAndFailsBeyondIt() {
    ExpectedFigures.Figure top1 = figure("fused.top1", 0.985, 0.002);
    assertTrue(FigureCheck.passes(top1, 0.985));
    assertTrue(FigureCheck.passes(top1, 0.987), "exactly at the tolerance passes");
    assertTrue(FigureCheck.passes(top1, 0.983));
    assertFalse(FigureCheck.passes(top1, 0.9871));
    assertFalse(FigureCheck.passes(top1, 0.9829));
  }

  @Test
  void aToleranceOfZeroAsksForTheExactValue() {
    // 0.1 + 0.2 is 0.30000000000000004 in binary floating point; recorded as such, it must pass.
    ExpectedFigures.Figure exact = figure("training.anti_lm_lambda", 0.1 + 0.2, 0);
    assertTrue(FigureCheck.passes(exact, 0.30000000000000004));
    assertFalse(FigureCheck.passes(exact, 0.3001));
    ExpectedFigures.Figure count = figure("training.epochs", 6.0, 0);
    assertTrue(FigureCheck.passes(count, 6.0));
    assertFalse(FigureCheck.passes(count, 5.0));
  }

  @Test
  void undefinedFiguresPassOnlyAgainstAnUndefinedExpectation() {
    ExpectedFigures.Figure none = figure("bm25.threshold", null, 0);
    assertTrue(FigureCheck.passes(none, Double.NaN));
    assertFalse(FigureCheck.passes(none, 0.93), "a threshold where none was expected is a change");
    assertFalse(FigureCheck.passes(none, null), "a figure the run did not give at all is missing");
    ExpectedFigures.Figure some = figure("fused.threshold", 0.996, 0.001);
    assertFalse(FigureCheck.passes(some, Double.NaN));
    assertFalse(FigureCheck.passes(some, null));
  }

  @Test
  void theTableListsEveryExpectedFigureInOrderWithItsResult() {
    ExpectedFigures expected = new ExpectedFigures("", Map.of(), List.of(
        figure("fused.top1", 0.985, 0.002), figure("fused.threshold", 0.996, 0.001),
        figure("bm25.threshold", null, 0), figure("samples.replied", 2.0, 0)));
    Map<String, Double> measured = new LinkedHashMap<>();
    measured.put("fused.top1", 0.9852);
    measured.put("fused.threshold", 0.893);
    measured.put("bm25.threshold", Double.NaN);
    measured.put("unlisted.figure", 1.0);

    List<FigureCheck.Row> rows = FigureCheck.compare(expected, measured);
    assertEquals(List.of("ok", "FAIL", "ok", "FAIL"), rows.stream().map(FigureCheck.Row::status).toList());
    assertFalse(FigureCheck.allPass(rows));
    String table = FigureCheck.table(rows);
    String[] lines = table.split("\n");
    assertEquals(6, lines.length, table);
    assertTrue(lines[0].matches("figure\\s+expected\\s+measured\\s+tolerance\\s+result"), lines[0]);
    assertTrue(lines[1].matches("fused\\.top1\\s+0\\.985000\\s+0\\.985200\\s+0\\.002000\\s+ok"), lines[1]);
    assertTrue(lines[2].matches("fused\\.threshold\\s+0\\.996000\\s+0\\.893000\\s+0\\.001000\\s+FAIL"), lines[2]);
    assertTrue(lines[3].matches("bm25\\.threshold\\s+undefined\\s+undefined\\s+0\\s+ok"), lines[3]);
    assertTrue(lines[4].matches("samples\\.replied\\s+2\\s+\\(missing\\)\\s+0\\s+FAIL"), lines[4]);
    assertEquals("2 of 4 figures as expected; 2 FAIL", lines[5]);
  }
}
