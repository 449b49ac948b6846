package org.precedent.engine.measure;

import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

class JudgedAnswerTest {

  @Test
  void rejectsNaNConfidenceSayingSo() {
    IllegalArgumentException e =
        assertThrows(IllegalArgumentException.class, () -> new JudgedAnswer(Double.NaN, true));
    assertTrue(e.getMessage().contains("NaN"));
  }

  @Test
  void rejectsConfidenceOutsideTheUnitInterval() {
    assertThrows(IllegalArgumentException.class, () -> new JudgedAnswer(-0.01, false));
    assertThrows(IllegalArgumentException.class, () -> new JudgedAnswer(1.0000001, true));
    assertThrows(IllegalArgumentException.class, () -> new JudgedAnswer(Double.POSITIVE_INFINITY, true));
  }

  @Test
  void acceptsBothEndsOfTheUnitInterval() {
    assertDoesNotThrow(() -> new JudgedAnswer(0.0, false));
    assertDoesNotThrow(() -> new JudgedAnswer(1.0, true));
  }

  @Test
  void everyMeasureRefusesAnEmptyListWithTheSameKindOfMessage() {
    List<Runnable> measures = List.of(
        () -> Calibration.brierScore(List.of()),
        () -> Calibration.expectedCalibrationError(List.of()),
        () -> Discrimination.auroc(List.of()),
        () -> SelectivePrediction.aurc(List.of()),
        () -> ThresholdTable.rows(List.of(), List.of(0.5)),
        () -> GuaranteedThreshold.recommend(List.of()),
        () -> Ranking.top1Accuracy(List.of()));
    for (Runnable measure : measures) {
      IllegalArgumentException e = assertThrows(IllegalArgumentException.class, measure::run);
      assertTrue(e.getMessage().endsWith("the input list is empty"), e.getMessage());
    }
  }

  @Test
  void nullListIsRefused() {
    assertThrows(NullPointerException.class, () -> Calibration.brierScore(null));
  }
}
