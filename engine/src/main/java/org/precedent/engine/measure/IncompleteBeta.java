package org.precedent.engine.measure;

/**
 * The regularized incomplete beta function I_x(a, b), which is the binomial tail in disguise:
 * P(X >= k) for X ~ Binomial(n, p) equals I_p(k, n - k + 1). The JDK offers neither it nor log-gamma.
 */
final class IncompleteBeta {
  private static final double EPS = 1e-15;
  private static final double TINY = 1e-300;

  // Lanczos approximation for log-gamma (Numerical Recipes, 3rd ed., Press et al. 2007, section 6.1),
  // g = 671/128 with 14 terms; relative error below 1e-15 for positive arguments.
  private static final double[] LANCZOS = {
    57.1562356658629235, -59.5979603554754912, 14.1360979747417471, -0.491913816097620199,
    .339946499848118887e-4, .465236289270485756e-4, -.983744753048795646e-4, .158088703224912494e-3,
    -.210264441724104883e-3, .217439618115212643e-3, -.164318106536763890e-3, .844182239838527433e-4,
    -.261908384015814087e-4, .368991826595316234e-5
  };

  private IncompleteBeta() {}

  /** ln Gamma(x) for x > 0. */
  static double logGamma(double x) {
    if (!(x > 0.0)) {
      throw new IllegalArgumentException("log-gamma needs a positive argument; got " + x);
    }
    double y = x;
    double tmp = x + 5.24218750000000000;
    tmp = (x + 0.5) * Math.log(tmp) - tmp;
    double series = 0.999999999999997092;
    for (double c : LANCZOS) {
      series += c / ++y;
    }
    return tmp + Math.log(2.5066282746310005 * series / x);
  }

  /** I_x(a, b) for a, b > 0 and x in [0, 1]. */
  static double regularized(double a, double b, double x) {
    if (!(a > 0.0 && b > 0.0)) {
      throw new IllegalArgumentException("incomplete beta needs a, b > 0; got a=" + a + ", b=" + b);
    }
    Inputs.closed01(x, "incomplete beta argument");
    if (x == 0.0 || x == 1.0) {
      return x;
    }
    double logFront = logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log1p(-x);
    double front = Math.exp(logFront);
    // The continued fraction converges fast only on one side of the mean a/(a+b); on the other side
    // use the symmetry I_x(a, b) = 1 - I_{1-x}(b, a) (Numerical Recipes, section 6.4).
    if (x < (a + 1.0) / (a + b + 2.0)) {
      return front * continuedFraction(a, b, x) / a;
    }
    return 1.0 - front * continuedFraction(b, a, 1.0 - x) / b;
  }

  /** The continued fraction for I_x(a, b), evaluated by the modified Lentz method. */
  private static double continuedFraction(double a, double b, double x) {
    double qab = a + b;
    double qap = a + 1.0;
    double qam = a - 1.0;
    double c = 1.0;
    double d = 1.0 - qab * x / qap;
    d = Math.abs(d) < TINY ? TINY : d;
    d = 1.0 / d;
    double h = d;
    // Iterations needed grow like sqrt(max(a, b)); this cap is far above that for any realistic count.
    int maxIterations = 10_000 + (int) Math.min(1e7, 10.0 * Math.sqrt(Math.max(a, b)));
    for (int m = 1; m <= maxIterations; m++) {
      int m2 = 2 * m;
      double aa = m * (b - m) * x / ((qam + m2) * (a + m2));
      d = 1.0 + aa * d;
      d = Math.abs(d) < TINY ? TINY : d;
      c = 1.0 + aa / c;
      c = Math.abs(c) < TINY ? TINY : c;
      d = 1.0 / d;
      h *= d * c;
      aa = -(a + m) * (qab + m) * x / ((a + m2) * (qap + m2));
      d = 1.0 + aa * d;
      d = Math.abs(d) < TINY ? TINY : d;
      c = 1.0 + aa / c;
      c = Math.abs(c) < TINY ? TINY : c;
      d = 1.0 / d;
      double delta = d * c;
      h *= delta;
      if (Math.abs(delta - 1.0) < EPS) {
        return h;
      }
    }
    throw new ArithmeticException("incomplete beta did not converge for a=" + a + ", b=" + b + ", x=" + x);
  }
}
