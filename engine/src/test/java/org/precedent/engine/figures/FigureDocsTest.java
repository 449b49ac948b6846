package org.precedent.engine.figures;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

class FigureDocsTest {
  private static final ExpectedFigures FIGURES = new ExpectedFigures("", Map.of(), List.of(
      new ExpectedFigures.Figure("fused.top1", null, 0.98524, 0.002, "0.000"),
      new ExpectedFigures.Figure("fused.threshold_coverage", null, 0.26166666666666666, 0.01, "0.0%"),
      new ExpectedFigures.Figure("bm25.threshold", null, null, 0, "0.000"),
      new ExpectedFigures.Figure("training.pairs", null, 2316.0, 0, "#,##0")));

  @Test
  void writesEachMarkedFigureInItsFormatAndLeavesTheRestAlone() {
    String doc = """
        # Figures
        | system | top-1 |
        | fused | **<!--fig fused.top1-->0.982<!--/fig-->** |
        Threshold answers <!--fig fused.threshold_coverage-->82.7%<!--/fig--> (as a share: \
        <!--fig fused.threshold_coverage 0.000-->0.827<!--/fig-->); BM25: <!--fig bm25.threshold-->0.9<!--/fig-->.
        <!--fig training.pairs-->1<!--/fig--> pairs, hand-written 0.5 stays.
        """;
    String expected = """
        # Figures
        | system | top-1 |
        | fused | **<!--fig fused.top1-->0.985<!--/fig-->** |
        Threshold answers <!--fig fused.threshold_coverage-->26.2%<!--/fig--> (as a share: \
        <!--fig fused.threshold_coverage 0.000-->0.262<!--/fig-->); BM25: <!--fig bm25.threshold-->none<!--/fig-->.
        <!--fig training.pairs-->2,316<!--/fig--> pairs, hand-written 0.5 stays.
        """;
    assertEquals(expected, FigureDocs.regenerate(doc, FIGURES, "DOC.md"));
    assertEquals(expected, FigureDocs.regenerate(expected, FIGURES, "DOC.md"), "regenerating is idempotent");
    assertEquals(5, FigureDocs.markers(doc));
  }

  @Test
  void roundsHalfUp() {
    // 0.0625 is exact in binary, so this is the rounding rule and not a representation error.
    assertEquals("0.063", FigureDocs.format(0.0625, "0.000", "here"));
    assertEquals("6.3%", FigureDocs.format(0.0625, "0.0%", "here"));
  }

  @Test
  void anUnknownFigureOrAnOpenMarkerIsAnErrorWithItsLine() {
    IllegalArgumentException unknown = assertThrows(IllegalArgumentException.class,
        () -> FigureDocs.regenerate("a\nb <!--fig fused.mrr-->0.9<!--/fig-->\n", FIGURES, "DOC.md"));
    assertEquals("DOC.md:2: no figure 'fused.mrr' in the expected figures", unknown.getMessage());
    IllegalArgumentException open = assertThrows(IllegalArgumentException.class,
        () -> FigureDocs.regenerate("<!--fig fused.top1-->0.9\n<!--/fig-->", FIGURES, "DOC.md"));
    assertTrue(open.getMessage().startsWith("DOC.md:1: a figure marker is not closed"), open.getMessage());
  }
}
