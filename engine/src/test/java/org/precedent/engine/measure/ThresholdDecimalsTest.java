package org.precedent.engine.measure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.util.Random;
import org.junit.jupiter.api.Test;

class ThresholdDecimalsTest {
  @Test
  void aThresholdIsWrittenWithTheDigitsItHas() {
    assertEquals("0.996", ThresholdDecimals.of(0.996));
    assertEquals("0.95", ThresholdDecimals.of(0.95));
    assertEquals("0.90", ThresholdDecimals.of(0.9));
    assertEquals("1.00", ThresholdDecimals.of(1.0));
    assertEquals("0.00", ThresholdDecimals.of(0.0));
    assertEquals("0.99604178", ThresholdDecimals.of(0.99604178));
    assertEquals("0.7000", ThresholdDecimals.of(0.7, 4));
    assertEquals("0.99604", ThresholdDecimals.of(0.99604, 4));
    assertEquals("Infinity", ThresholdDecimals.of(Double.POSITIVE_INFINITY));
  }

  @Test
  void aConfidenceIsCutToTheThresholdsDecimalsNeverRoundedUp() {
    assertEquals("0.980", ThresholdDecimals.confidence(0.98, 0.996));
    assertEquals("0.995", ThresholdDecimals.confidence(0.9959999, 0.996));
    assertEquals("0.996", ThresholdDecimals.confidence(0.996, 0.996));
    assertEquals("0.99", ThresholdDecimals.confidence(0.999999, 0.95));
    // 0.29 is below 0.29 as a double would be; the written form must not fall to 0.28.
    assertEquals("0.29", ThresholdDecimals.confidence(0.29, 0.29));
  }

  @Test
  void theWrittenConfidenceComparesWithTheWrittenThresholdAsTheNumbersDo() {
    // Self-consistency over thresholds of 1 to 6 decimals and arbitrary doubles, with confidences
    // one ulp either side of each threshold, where rounding would most easily cross it.
    Random random = new Random(11);
    for (int i = 0; i < 20_000; i++) {
      double t = i % 2 == 0 ? Math.round(random.nextDouble() * Math.pow(10, 1 + i % 6))
          / Math.pow(10, 1 + i % 6) : random.nextDouble();
      double[] confidences = {t, Math.nextDown(t), Math.nextUp(t), t - 1e-4, t + 1e-4,
          random.nextDouble()};
      for (double c : confidences) {
        if (c < 0 || c > 1) {
          continue;
        }
        BigDecimal shownC = new BigDecimal(ThresholdDecimals.confidence(c, t));
        BigDecimal shownT = new BigDecimal(ThresholdDecimals.of(t));
        assertEquals(c < t, shownC.compareTo(shownT) < 0, "confidence " + c + " threshold " + t
            + " written " + shownC + " and " + shownT);
        assertEquals(t, shownT.doubleValue(), "a threshold must read back as itself: " + t);
      }
    }
  }

  @Test
  void theShortestDecimalInARangeRepliesToTheSameAnswers() {
    assertEquals(0.996, ThresholdDecimals.shortestAbove(0.99504178, 0.99604178));
    assertEquals(0.9, ThresholdDecimals.shortestAbove(0.899, 0.9));
    assertEquals(0.99604, ThresholdDecimals.shortestAbove(0.996031, 0.996042));
    assertEquals(0.5, ThresholdDecimals.shortestAbove(0.4, 0.99));
    assertEquals(0.7, ThresholdDecimals.shortestAbove(0.7, 0.7), "an empty range keeps the bound");
    Random random = new Random(5);
    for (int i = 0; i < 20_000; i++) {
      double high = random.nextDouble();
      double low = high - random.nextDouble() * Math.pow(10, -1 - random.nextInt(8));
      double t = ThresholdDecimals.shortestAbove(low, high);
      assertTrue(t > low && t <= high, low + " < " + t + " <= " + high);
    }
  }
}
