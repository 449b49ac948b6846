package org.precedent.engine.evaluate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;
import org.precedent.engine.measure.RiskCoveragePoint;
import org.precedent.engine.measure.JudgedAnswer;
import org.precedent.engine.measure.SelectivePrediction;

class CurvesTest {
  @Test
  void downsamplingKeepsFirstAndLastPointsInOrderWithoutRepeats() {
    List<Integer> points = IntStream.range(0, 1001).boxed().toList();
    List<Integer> thin = Curves.downsample(points, 200);
    assertEquals(200, thin.size());
    assertEquals(0, thin.get(0));
    assertEquals(1000, thin.get(199));
    for (int i = 1; i < thin.size(); i++) {
      assertTrue(thin.get(i) > thin.get(i - 1), "strictly increasing at " + i);
    }
  }

  @Test
  void shortCurveIsKeptWhole() {
    assertEquals(List.of(1, 2, 3), Curves.downsample(List.of(1, 2, 3), 200));
  }

  @Test
  void reportCurveIsThinnedButStartsAndEndsWhereTheFullCurveDoes() {
    List<EvaluatedTicket> tickets = new ArrayList<>();
    for (int i = 0; i < 500; i++) {
      // 500 distinct confidences give a 500-point curve; every third reply wrong.
      tickets.add(new EvaluatedTicket("t" + i, "c", true, i % 3 == 0 ? 2 : 1, i / 500.0));
    }
    SystemRun run = new SystemRun("A", tickets);
    List<JudgedAnswer> scored = tickets.stream().map(EvaluatedTicket::scored).toList();
    List<RiskCoveragePoint> full = SelectivePrediction.riskCoverageCurve(scored);
    List<RiskCoveragePoint> kept = Fixtures.report("d", run).systems().get(0).riskCoverage();
    assertEquals(500, full.size());
    assertEquals(EvaluationReports.MAX_CURVE_POINTS, kept.size());
    assertEquals(full.get(0), kept.get(0));
    assertEquals(full.get(499), kept.get(kept.size() - 1));
  }
}
