package org.precedent.engine.stats;

/**
 * Solves M x = g for a symmetric positive semi-definite M (only the lower triangle is read) by
 * Cholesky factorisation. Without a penalty M can be singular (a feature constant after
 * standardisation, or two identical features); a small ridge is then added, growing tenfold until
 * the factorisation succeeds. The solution is still an ascent direction for g, which is all the
 * Newton step needs, and the line search guards the rest.
 */
final class SymmetricSolver {
  private SymmetricSolver() {}

  static double[] solve(double[][] m, double[] g) {
    int d = g.length;
    double largest = 0;
    for (int a = 0; a < d; a++) {
      largest = Math.max(largest, Math.abs(m[a][a]));
    }
    double ridge = 0;
    double smallest = 1e-12 * Math.max(largest, 1e-300);
    for (int attempt = 0; attempt < 40; attempt++) {
      double[][] l = cholesky(m, ridge, smallest);
      if (l != null) {
        return substitute(l, g);
      }
      ridge = ridge == 0 ? 1e-10 * Math.max(largest, 1e-12) : ridge * 10;
    }
    throw new IllegalStateException("Newton system could not be factorised; the features are degenerate");
  }

  /** Whether M (lower triangle read) factorises with every pivot, before its square root, above {@code minPivot}. */
  static boolean positiveDefinite(double[][] m, double minPivot) {
    return cholesky(m, 0, minPivot) != null;
  }

  /** Lower factor L with L L^T = M + ridge I, or null if a pivot falls to {@code smallest} or below. */
  private static double[][] cholesky(double[][] m, double ridge, double smallest) {
    int d = m.length;
    double[][] l = new double[d][d];
    for (int a = 0; a < d; a++) {
      for (int b = 0; b <= a; b++) {
        double sum = m[a][b] + (a == b ? ridge : 0);
        for (int k = 0; k < b; k++) {
          sum -= l[a][k] * l[b][k];
        }
        if (a == b) {
          if (!(sum > smallest)) {
            return null;
          }
          l[a][a] = Math.sqrt(sum);
        } else {
          l[a][b] = sum / l[b][b];
        }
      }
    }
    return l;
  }

  private static double[] substitute(double[][] l, double[] g) {
    int d = g.length;
    double[] v = new double[d];
    for (int a = 0; a < d; a++) {
      double sum = g[a];
      for (int k = 0; k < a; k++) {
        sum -= l[a][k] * v[k];
      }
      v[a] = sum / l[a][a];
    }
    double[] x = new double[d];
    for (int a = d - 1; a >= 0; a--) {
      double sum = v[a];
      for (int k = a + 1; k < d; k++) {
        sum -= l[k][a] * x[k];
      }
      x[a] = sum / l[a][a];
    }
    return x;
  }
}
