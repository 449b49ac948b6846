package org.precedent.engine.measure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

class IncompleteBetaTest {

  @Test
  void logGammaMatchesFactorialsAndGammaOfOneHalf() {
    // Gamma(n) = (n-1)! and Gamma(1/2) = sqrt(pi): Abramowitz and Stegun (1964), 6.1.6 and 6.1.8
    // (equation numbers in this class from memory).
    double logFactorial = 0.0;
    for (int n = 1; n <= 300; n++) {
      assertEquals(logFactorial, IncompleteBeta.logGamma(n), 1e-12 * Math.max(1.0, logFactorial), "n=" + n);
      logFactorial += Math.log(n);
    }
    assertEquals(0.5 * Math.log(Math.PI), IncompleteBeta.logGamma(0.5), 1e-14);
  }

  @Test
  void closedFormsForUnitParameters() {
    // I_x(a, 1) = x^a and I_x(1, b) = 1 - (1 - x)^b follow from B(a, 1) = 1/a; see Abramowitz and
    // Stegun (1964), 26.5.
    for (double x : new double[] {0.01, 0.2, 0.5, 0.77, 0.999}) {
      for (double p : new double[] {0.5, 1, 3, 40}) {
        assertEquals(Math.pow(x, p), IncompleteBeta.regularized(p, 1, x), 1e-13);
        assertEquals(1 - Math.pow(1 - x, p), IncompleteBeta.regularized(1, p, x), 1e-13);
      }
    }
  }

  @Test
  void symmetryRelationHolds() {
    // I_x(a, b) = 1 - I_{1-x}(b, a): Abramowitz and Stegun (1964), 26.5.2; so I_{1/2}(a, a) = 1/2.
    assertEquals(0.5, IncompleteBeta.regularized(7.5, 7.5, 0.5), 1e-14);
    assertEquals(1 - IncompleteBeta.regularized(12, 3, 0.3), IncompleteBeta.regularized(3, 12, 0.7), 1e-14);
  }

  @Test
  void equalsTheBinomialTailSummedDirectly() {
    // P(X >= k; n, p) = I_p(k, n - k + 1): Abramowitz and Stegun (1964), 26.5.24; tail summed term
    // by term in BinomialTail.
    int[][] cases = {{1, 5}, {3, 5}, {40, 100}, {950, 1000}, {17, 18}};
    for (int[] c : cases) {
      for (double p : new double[] {0.05, 0.4, 0.9, 0.97}) {
        double expected = BinomialTail.atLeast(c[0], c[1], p);
        assertEquals(expected, IncompleteBeta.regularized(c[0], c[1] - c[0] + 1, p),
            1e-12 + 1e-10 * expected, c[0] + "/" + c[1] + " p=" + p);
      }
    }
  }

  @Test
  void rejectsArgumentsOutsideTheDomain() {
    assertThrows(IllegalArgumentException.class, () -> IncompleteBeta.regularized(0, 1, 0.5));
    assertThrows(IllegalArgumentException.class, () -> IncompleteBeta.regularized(1, 1, 1.5));
    assertThrows(IllegalArgumentException.class, () -> IncompleteBeta.logGamma(0));
  }
}
