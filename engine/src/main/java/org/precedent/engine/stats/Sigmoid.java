package org.precedent.engine.stats;

/** The logistic function and its log terms, written so large arguments neither overflow nor lose digits. */
final class Sigmoid {
  private Sigmoid() {}

  /** 1 / (1 + e^-x), evaluated on the side where the exponential cannot overflow. */
  static double logistic(double x) {
    if (x >= 0) {
      return 1.0 / (1.0 + Math.exp(-x));
    }
    double e = Math.exp(x);
    return e / (1.0 + e);
  }

  /** log(1 + e^x); the plain formula returns infinity from x of about 710 upwards. */
  static double softplus(double x) {
    return Math.max(x, 0.0) + Math.log1p(Math.exp(-Math.abs(x)));
  }

  /** Log-likelihood of one outcome under log-odds eta: log p if positive, log(1 - p) otherwise. */
  static double logLikelihood(boolean positive, double eta) {
    return positive ? -softplus(-eta) : -softplus(eta);
  }
}
