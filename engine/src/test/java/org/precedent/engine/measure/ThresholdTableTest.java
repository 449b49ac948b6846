package org.precedent.engine.measure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

class ThresholdTableTest {
  private static final double EPS = 1e-9;

  private static List<JudgedAnswer> newcombeSample() {
    // 263 answers at 0.8 of which 81 right (Newcombe's 81/263 example), 37 right answers at 0.3.
    List<JudgedAnswer> answers = new ArrayList<>();
    for (int i = 0; i < 263; i++) {
      answers.add(new JudgedAnswer(0.8, i < 81));
    }
    for (int i = 0; i < 37; i++) {
      answers.add(new JudgedAnswer(0.3, true));
    }
    return answers;
  }

  @Test
  void rowsReportShareAnsweredPrecisionIntervalAndWrongRepliesPerThousand() {
    List<ThresholdRow> rows = ThresholdTable.rows(newcombeSample(), List.of(0.9, 0.8, 0.3));
    assertEquals(3, rows.size());

    // Nothing reaches 0.9: no automatic replies, so no precision to report and no wrong replies.
    ThresholdRow none = rows.get(0);
    assertEquals(0, none.answered());
    assertEquals(0.0, none.answeredShare());
    assertTrue(Double.isNaN(none.precision()));
    assertTrue(Double.isNaN(none.precisionLower()));
    assertEquals(0.0, none.wrongPerThousand());

    // At 0.8: 263 of 300 answered, 81 right. Interval: Newcombe (1998) Table I, method 3, 81/263 ->
    // 0.2553 to 0.3662 (from memory). Wrong per 1,000 by hand: 1000 * 182 / 300 = 606.67.
    ThresholdRow mid = rows.get(1);
    assertEquals(263, mid.answered());
    assertEquals(263.0 / 300, mid.answeredShare(), EPS);
    assertEquals(81.0 / 263, mid.precision(), EPS);
    assertEquals(0.2553, mid.precisionLower(), 5e-5);
    assertEquals(0.3662, mid.precisionUpper(), 5e-5);
    assertEquals(1000.0 * 182 / 300, mid.wrongPerThousand(), EPS);

    // At 0.3 everything is answered: 118 of 300 right; the 37 extra answers are right, so the wrong
    // count per 1,000 stays the same while the share rises to 1 (hand-computed).
    ThresholdRow all = rows.get(2);
    assertEquals(300, all.answered());
    assertEquals(1.0, all.answeredShare(), EPS);
    assertEquals(118.0 / 300, all.precision(), EPS);
    assertEquals(1000.0 * 182 / 300, all.wrongPerThousand(), EPS);
  }

  @Test
  void thresholdIsInclusive() {
    // Convention of this project: reply when confidence >= threshold (no outside source).
    List<ThresholdRow> rows = ThresholdTable.rows(List.of(new JudgedAnswer(0.7, true)), List.of(0.7));
    assertEquals(1, rows.get(0).answered());
  }

  @Test
  void rejectsEmptyInputsAndThresholdsOutsideTheUnitInterval() {
    List<JudgedAnswer> one = List.of(new JudgedAnswer(0.5, true));
    assertThrows(IllegalArgumentException.class, () -> ThresholdTable.rows(List.of(), List.of(0.5)));
    assertThrows(IllegalArgumentException.class, () -> ThresholdTable.rows(one, List.of()));
    assertThrows(IllegalArgumentException.class, () -> ThresholdTable.rows(one, List.of(1.5)));
    assertThrows(IllegalArgumentException.class, () -> ThresholdTable.rows(one, List.of(Double.NaN)));
  }
}
