package org.precedent.engine.measure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class ProportionsTest {

  @Test
  void wilsonIntervalMatchesNewcombesTable() {
    // Newcombe (1998), "Two-sided confidence intervals for the single proportion: comparison of seven
    // methods", Statistics in Medicine 17:857-872, Table I, method 3 (score, no continuity
    // correction), 95%. Values from memory; they agree with the Wilson (1927) formula to 4 decimals.
    assertInterval(0.2553, 0.3662, Proportions.wilson(81, 263, Proportions.Z_95));
    assertInterval(0.0624, 0.1605, Proportions.wilson(15, 148, Proportions.Z_95));
    assertInterval(0.0000, 0.1611, Proportions.wilson(0, 20, Proportions.Z_95));
    assertInterval(0.0061, 0.1718, Proportions.wilson(1, 29, Proportions.Z_95));
  }

  @Test
  void wilsonIntervalOfAllSuccessesEndsAtOne() {
    // Wilson (1927): with x = n the upper limit is exactly 1 and the lower is n / (n + z^2).
    Interval all = Proportions.wilson(20, 20, Proportions.Z_95);
    assertEquals(1.0, all.upper(), 1e-12);
    assertEquals(20 / (20 + Proportions.Z_95 * Proportions.Z_95), all.lower(), 1e-12);
  }

  @Test
  void clopperPearsonLowerBoundMatchesNewcombesExactIntervals() {
    // Newcombe (1998) Table I, method 5 (Clopper-Pearson exact), 95% two-sided: its lower limit is the
    // one-sided lower bound at alpha = 0.025. From memory: 81/263 -> 0.2527, 15/148 -> 0.0578,
    // 1/29 -> 0.0009.
    assertEquals(0.2527, Proportions.clopperPearsonLower(81, 263, 0.025), 5e-5);
    assertEquals(0.0578, Proportions.clopperPearsonLower(15, 148, 0.025), 5e-5);
    assertEquals(0.0009, Proportions.clopperPearsonLower(1, 29, 0.025), 5e-5);
  }

  @Test
  void clopperPearsonLowerBoundWithAllSuccessesIsAlphaToTheOneOverN() {
    // Clopper and Pearson (1934): the lower limit solves P(X >= x; p) = alpha; for x = n that tail is
    // p^n, so the bound is alpha^(1/n). Checked through the general beta-quantile path.
    for (int n : new int[] {1, 2, 7, 59, 100, 1000}) {
      for (double alpha : new double[] {0.05, 0.01, 0.005}) {
        assertEquals(Math.pow(alpha, 1.0 / n), Proportions.clopperPearsonLower(n, n, alpha), 1e-12,
            "n=" + n + " alpha=" + alpha);
      }
    }
  }

  @Test
  void clopperPearsonLowerBoundWithOneSuccessHasAClosedForm() {
    // With x = 1 the tail is P(X >= 1; p) = 1 - (1 - p)^n, i.e. I_p(1, n) = 1 - (1 - p)^n
    // (Abramowitz and Stegun 1964, 26.5, from B(1, b) = 1/b); solving 1 - (1 - L)^n = alpha gives
    // L = 1 - (1 - alpha)^(1/n). This example used to test the hand-written incomplete beta.
    for (int n : new int[] {1, 3, 29, 400}) {
      for (double alpha : new double[] {0.05, 0.025, 0.005}) {
        double expected = -Math.expm1(Math.log1p(-alpha) / n);
        assertEquals(expected, Proportions.clopperPearsonLower(1, n, alpha), 1e-12 * Math.max(1.0, expected),
            "n=" + n + " alpha=" + alpha);
      }
    }
  }

  @Test
  void clopperPearsonLowerBoundWithNoSuccessesIsZero() {
    // Clopper and Pearson (1934): with x = 0 no p > 0 is excluded from below.
    assertEquals(0.0, Proportions.clopperPearsonLower(0, 50, 0.05));
  }

  @Test
  void clopperPearsonLowerBoundPutsExactlyAlphaInTheUpperBinomialTail() {
    // Definition (Clopper and Pearson 1934): at the lower bound L, P(X >= x; n, L) = alpha, with the
    // tail summed term by term (BinomialTail), not through the incomplete beta function.
    int[][] cases = {{1, 10}, {5, 10}, {9, 10}, {81, 263}, {297, 300}, {480, 500}, {700, 721}};
    for (int[] c : cases) {
      for (double alpha : new double[] {0.05, 0.005}) {
        double bound = Proportions.clopperPearsonLower(c[0], c[1], alpha);
        String label = c[0] + "/" + c[1] + " alpha=" + alpha;
        assertEquals(alpha, BinomialTail.atLeast(c[0], c[1], bound), alpha * 1e-8, label);
        assertTrue(BinomialTail.atLeast(c[0], c[1], bound + 1e-6) > alpha, label);
        assertTrue(BinomialTail.atLeast(c[0], c[1], bound - 1e-6) < alpha, label);
        assertTrue(bound < (double) c[0] / c[1], label);
      }
    }
  }

  @Test
  void rejectsImpossibleCountsAndLevels() {
    assertThrows(IllegalArgumentException.class, () -> Proportions.wilson(3, 0, Proportions.Z_95));
    assertThrows(IllegalArgumentException.class, () -> Proportions.wilson(4, 3, Proportions.Z_95));
    assertThrows(IllegalArgumentException.class, () -> Proportions.wilson(1, 3, Double.NaN));
    assertThrows(IllegalArgumentException.class, () -> Proportions.clopperPearsonLower(-1, 3, 0.05));
    assertThrows(IllegalArgumentException.class, () -> Proportions.clopperPearsonLower(1, 3, 0.0));
    assertThrows(IllegalArgumentException.class, () -> Proportions.clopperPearsonLower(1, 3, 1.0));
  }

  private static void assertInterval(double lower, double upper, Interval actual) {
    // Published values are rounded to 4 decimals.
    assertEquals(lower, actual.lower(), 5e-5, "lower");
    assertEquals(upper, actual.upper(), 5e-5, "upper");
  }
}
