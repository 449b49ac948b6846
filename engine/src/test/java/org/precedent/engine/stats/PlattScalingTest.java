package org.precedent.engine.stats;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class PlattScalingTest {
  private static final double[] SCORES = {-2.1, -1.5, -1.2, -0.7, -0.3, 0.0, 0.2, 0.6, 0.9, 1.3, 1.8, 2.4};
  private static final boolean[] LABELS =
      {false, false, true, false, false, true, false, true, true, false, true, true};

  @Test
  void targetsAreSmoothedAsPlattPrescribes() {
    // Platt (1999), section 2.2: t+ = (N+ + 1) / (N+ + 2), t- = 1 / (N- + 2). By hand, 3 right and
    // 2 wrong: t+ = 4/5, t- = 1/4; 4 right and none wrong: t+ = 5/6.
    assertArrayEquals(new double[] {0.8, 0.25, 0.8, 0.25, 0.8},
        PlattScaling.targets(new boolean[] {true, false, true, false, true}), 1e-15);
    assertArrayEquals(new double[] {5.0 / 6, 5.0 / 6, 5.0 / 6, 5.0 / 6},
        PlattScaling.targets(new boolean[] {true, true, true, true}), 1e-15);
  }

  @Test
  void reachesTheSameMinimumAsABruteForceSearch() {
    // Independent minimisation of Platt's smoothed cross-entropy (Platt 1999, eq. 3 with the targets
    // of section 2.2): a 0.02 grid over [-8, 8]^2, then compass search (Kolda, Lewis and Torczon 2003,
    // SIAM Review 45) down to steps of 1e-10. The objective is convex, so both find the one minimum.
    // Tolerance 1e-4: Lin, Lin and Weng stop once both gradient entries are below 1e-5, and the
    // Hessian here is of order 1.
    double[] t = PlattScaling.targets(LABELS);
    double bestA = 0;
    double bestB = 0;
    double best = Double.POSITIVE_INFINITY;
    for (int i = -400; i <= 400; i++) {
      for (int j = -400; j <= 400; j++) {
        double value = crossEntropy(t, i * 0.02, j * 0.02);
        if (value < best) {
          best = value;
          bestA = i * 0.02;
          bestB = j * 0.02;
        }
      }
    }
    assertTrue(Math.abs(bestA) < 7.9 && Math.abs(bestB) < 7.9, "grid minimum on the boundary");
    for (double step = 0.02; step > 1e-10; ) {
      boolean moved = false;
      for (double[] d : new double[][] {{1, 0}, {-1, 0}, {0, 1}, {0, -1}}) {
        double value = crossEntropy(t, bestA + step * d[0], bestB + step * d[1]);
        if (value < best) {
          best = value;
          bestA += step * d[0];
          bestB += step * d[1];
          moved = true;
        }
      }
      if (!moved) {
        step /= 2;
      }
    }
    PlattCalibrator fitted = PlattScaling.fit(SCORES, LABELS);
    assertEquals(bestA, fitted.a(), 1e-4);
    assertEquals(bestB, fitted.b(), 1e-4);
  }

  @Test
  void equalScoresGiveTheMeanTarget() {
    // With one score f for all, F depends on p = 1/(1 + e^(A f + B)) only, and
    // dF/dp = sum_i (p - t_i) / (p (1 - p)) vanishes at p = mean target. 3 right, 2 wrong:
    // (3 * 4/5 + 2 * 1/4) / 5 = 2.9 / 5 = 0.58 (by hand). The stopping rule |g2| = 5 |0.58 - p| < 1e-5
    // bounds the error by 2e-6.
    double[] scores = {0.0, 0.0, 0.0, 0.0, 0.0};
    PlattCalibrator fitted = PlattScaling.fit(scores, new boolean[] {true, false, true, false, true});
    assertEquals(0.58, fitted.calibrate(0.0), 2e-6);
    assertEquals(0.0, fitted.a(), 1e-12);
  }

  @Test
  void aSingleClassStaysFinite() {
    // Four right answers: every target is 5/6 (Platt's smoothing), so p_i = 5/6 for all i, that is
    // A = 0 and B = log(1/5), is the exact minimum. Platt (1999) adds the smoothing to avoid the
    // unbounded fit 0/1 targets would give here.
    PlattCalibrator fitted = PlattScaling.fit(new double[] {-1, 0, 1, 2}, new boolean[] {true, true, true, true});
    assertEquals(0.0, fitted.a(), 1e-4);
    assertEquals(Math.log(0.2), fitted.b(), 1e-4);
    assertEquals(5.0 / 6, fitted.calibrate(3.0), 1e-4);
  }

  @Test
  void higherScoresForRightAnswersGiveANegativeSlopeAndRisingProbabilities() {
    // Platt's sign convention: P = 1/(1 + exp(A f + B)) increases in f exactly when A < 0.
    PlattCalibrator fitted = PlattScaling.fit(SCORES, LABELS);
    assertTrue(fitted.a() < 0, "A = " + fitted.a());
    double previous = 0;
    for (double f = -5; f <= 5; f += 0.25) {
      double p = fitted.calibrate(f);
      assertTrue(p > previous, "not rising at " + f);
      previous = p;
    }
  }

  @Test
  void negatingTheScoresNegatesTheSlope() {
    // F(A, B; -f) = F(-A, B; f) term by term, so the minimum mirrors (follows from the objective).
    double[] negated = new double[SCORES.length];
    for (int i = 0; i < negated.length; i++) {
      negated[i] = -SCORES[i];
    }
    PlattCalibrator plain = PlattScaling.fit(SCORES, LABELS);
    PlattCalibrator mirrored = PlattScaling.fit(negated, LABELS);
    assertEquals(-plain.a(), mirrored.a(), 1e-9);
    assertEquals(plain.b(), mirrored.b(), 1e-9);
  }

  @Test
  void refusesUnusableInput() {
    assertThrows(IllegalArgumentException.class, () -> PlattScaling.fit(new double[0], new boolean[0]));
    assertThrows(IllegalArgumentException.class, () -> PlattScaling.fit(new double[] {1}, new boolean[] {true, false}));
    assertThrows(IllegalArgumentException.class,
        () -> PlattScaling.fit(new double[] {1, Double.NaN}, new boolean[] {true, false}));
    assertThrows(IllegalArgumentException.class, () -> new PlattCalibrator(Double.NaN, 0));
    assertThrows(IllegalArgumentException.class, () -> new PlattCalibrator(-1, 0).calibrate(Double.NaN));
  }

  /** Platt (1999) eq. 3, written directly from the definition for the brute-force check. */
  private static double crossEntropy(double[] t, double a, double b) {
    double value = 0;
    for (int i = 0; i < SCORES.length; i++) {
      double p = 1 / (1 + Math.exp(a * SCORES[i] + b));
      value -= t[i] * Math.log(p) + (1 - t[i]) * Math.log(1 - p);
    }
    return value;
  }
}
