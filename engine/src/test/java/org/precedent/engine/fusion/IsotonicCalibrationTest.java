package org.precedent.engine.fusion;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.Random;
import org.junit.jupiter.api.Test;

class IsotonicCalibrationTest {
  private static double[] ones(int n) {
    double[] w = new double[n];
    Arrays.fill(w, 1.0);
    return w;
  }

  @Test
  void poolsTheTextbookSequence() {
    // Pool-adjacent-violators (Barlow et al. 1972), computed by hand: in 1, 3, 2, 4, 3, 5 the pair
    // (3, 2) violates order and pools to 2.5; then (4, 3) pools to 3.5; 1 < 2.5 < 3.5 < 5 holds.
    assertArrayEquals(new double[] {1, 2.5, 2.5, 3.5, 3.5, 5},
        IsotonicCalibration.poolAdjacentViolators(new double[] {1, 3, 2, 4, 3, 5}, ones(6)), 1e-15);
    // A cascade, by hand: 1, 4, 3, 2 -> (4, 3) = 3.5 -> (3.5 over two, 2) = (7 + 2) / 3 = 3.
    assertArrayEquals(new double[] {1, 3, 3, 3},
        IsotonicCalibration.poolAdjacentViolators(new double[] {1, 4, 3, 2}, ones(4)), 1e-15);
    // Weighted, by hand: 3 with weight 1 and 1 with weight 3 pool to (3 + 3) / 4 = 1.5.
    assertArrayEquals(new double[] {1.5, 1.5},
        IsotonicCalibration.poolAdjacentViolators(new double[] {3, 1}, new double[] {1, 3}), 1e-15);
  }

  @Test
  void agreesWithTheMaxMinFormula() {
    // Robertson, Wright and Dykstra (1988), "Order Restricted Statistical Inference", Theorem 1.4.4:
    // the weighted isotonic regression is y*_i = max_{s <= i} min_{t >= i} Av(s, t), with Av the
    // weighted mean of y_s..y_t. Computed here by that formula, independently of the stack.
    Random random = new Random(42);
    for (int trial = 0; trial < 300; trial++) {
      int n = 1 + random.nextInt(12);
      double[] y = new double[n];
      double[] w = new double[n];
      for (int i = 0; i < n; i++) {
        y[i] = random.nextInt(5) + random.nextDouble();
        w[i] = 0.5 + random.nextInt(4);
      }
      double[] fitted = IsotonicCalibration.poolAdjacentViolators(y, w);
      for (int i = 0; i < n; i++) {
        double maxOfMins = Double.NEGATIVE_INFINITY;
        for (int s = 0; s <= i; s++) {
          double min = Double.POSITIVE_INFINITY;
          for (int t = i; t < n; t++) {
            double sum = 0;
            double weight = 0;
            for (int k = s; k <= t; k++) {
              sum += w[k] * y[k];
              weight += w[k];
            }
            min = Math.min(min, sum / weight);
          }
          maxOfMins = Math.max(maxOfMins, min);
        }
        assertEquals(maxOfMins, fitted[i], 1e-12, "trial " + trial + ", position " + i);
      }
    }
  }

  @Test
  void calibratorIsFlatWithinBlocksAndLinearBetweenThem() {
    // Labels 0, 1, 0, 1, 1 at scores 1..5 pool by hand to blocks {1} -> 0, {2, 3} -> 0.5, {4, 5} -> 1.
    // Points kept: each block's first and last score. Between 3 (0.5) and 4 (1) the map is linear:
    // 3.5 -> 0.75 (by hand).
    IsotonicCalibrator calibrator = IsotonicCalibration.fit(
        new double[] {1, 2, 3, 4, 5}, new boolean[] {false, true, false, true, true});
    assertArrayEquals(new double[] {1, 2, 3, 4, 5}, calibrator.thresholds());
    assertArrayEquals(new double[] {0, 0.5, 0.5, 1, 1}, calibrator.values(), 1e-15);
    assertEquals(0.5, calibrator.calibrate(2.5), 1e-15);
    assertEquals(0.75, calibrator.calibrate(3.5), 1e-15);
    assertEquals(0.25, calibrator.calibrate(1.5), 1e-15);
    assertEquals(0.0, calibrator.calibrate(-10), 0);
    assertEquals(1.0, calibrator.calibrate(10), 0);
  }

  @Test
  void equalScoresArePooledFirst() {
    // By hand: score 1 has one right of two (0.5), score 2 none of two (0); 0.5 > 0 violates order,
    // so both pool to 1 / 4 = 0.25.
    IsotonicCalibrator calibrator =
        IsotonicCalibration.fit(new double[] {2, 1, 1, 2}, new boolean[] {false, true, false, false});
    assertArrayEquals(new double[] {1, 2}, calibrator.thresholds());
    assertArrayEquals(new double[] {0.25, 0.25}, calibrator.values(), 1e-15);
  }

  @Test
  void outputNeverDecreases() {
    // Defining property of isotonic regression (Barlow et al. 1972).
    Random random = new Random(8);
    double[] scores = new double[500];
    boolean[] labels = new boolean[500];
    for (int i = 0; i < scores.length; i++) {
      scores[i] = random.nextGaussian();
      labels[i] = random.nextDouble() < Sigmoid.logistic(2 * scores[i]);
    }
    IsotonicCalibrator calibrator = IsotonicCalibration.fit(scores, labels);
    double previous = -1;
    for (double s = -4; s <= 4; s += 0.01) {
      double p = calibrator.calibrate(s);
      assertTrue(p >= previous && p >= 0 && p <= 1, "at " + s);
      previous = p;
    }
    assertTrue(calibrator.calibrate(4) > calibrator.calibrate(-4));
  }

  @Test
  void refusesUnusableInput() {
    assertThrows(IllegalArgumentException.class, () -> IsotonicCalibration.fit(new double[0], new boolean[0]));
    assertThrows(IllegalArgumentException.class,
        () -> IsotonicCalibration.fit(new double[] {Double.NaN}, new boolean[] {true}));
    assertThrows(IllegalArgumentException.class,
        () -> new IsotonicCalibrator(new double[] {1, 1}, new double[] {0.1, 0.2}));
    assertThrows(IllegalArgumentException.class,
        () -> new IsotonicCalibrator(new double[] {1, 2}, new double[] {0.3, 0.2}));
    assertThrows(IllegalArgumentException.class,
        () -> new IsotonicCalibrator(new double[] {1, 2}, new double[] {0.3, 1.2}));
    assertThrows(IllegalArgumentException.class, () -> new IsotonicCalibrator(new double[0], new double[0]));
  }
}
