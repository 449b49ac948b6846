package org.precedent.engine.measure;

/**
 * Test-only binomial tail by direct summation of the probability mass function, so bounds built on
 * the incomplete beta function can be checked by a route that does not use it.
 */
final class BinomialTail {
  private BinomialTail() {}

  /** P(X >= k) for X ~ Binomial(n, p), summing C(n, j) p^j (1-p)^(n-j) in log space for j = k..n. */
  static double atLeast(int k, int n, double p) {
    if (k <= 0) {
      return 1.0;
    }
    if (p <= 0.0) {
      return 0.0;
    }
    if (p >= 1.0) {
      return 1.0;
    }
    double[] logFactorial = new double[n + 1];
    for (int i = 1; i <= n; i++) {
      logFactorial[i] = logFactorial[i - 1] + Math.log(i);
    }
    double sum = 0.0;
    for (int j = k; j <= n; j++) {
      double logTerm = logFactorial[n] - logFactorial[j] - logFactorial[n - j]
          + j * Math.log(p) + (n - j) * Math.log1p(-p);
      sum += Math.exp(logTerm);
    }
    return sum;
  }
}
