package org.precedent.engine.stats;

import java.util.Arrays;
import java.util.HashSet;
import java.util.List;

/**
 * A fitted logistic model, kept in the standardised units it was fitted in: log-odds = bias + sum_j
 * weights[j] * (x[j] - mean[j]) / std[j]. Storing mean and std with the weights lets the model be
 * applied to raw features, saved and reloaded without refitting.
 *
 * <p>Arrays are copied in and out, so a model cannot change after construction. A fusion model
 * saves it with Jackson, as a record.
 *
 * @param featureNames one distinct, non-blank name per feature, in column order
 * @param mean per-feature centre subtracted before scaling
 * @param std per-feature scale, positive (a feature that was constant when fitted carries 1)
 * @param weights per-feature weights in standardised units
 * @param bias log-odds at the mean feature vector
 * @param lambda the L2 penalty the model was fitted with, kept for reporting
 */
public record LogisticModel(
    List<String> featureNames, double[] mean, double[] std, double[] weights, double bias, double lambda) {

  public LogisticModel {
    if (featureNames == null) {
      throw new IllegalArgumentException("feature names must not be null");
    }
    for (String name : featureNames) {
      if (name == null || name.isBlank()) {
        throw new IllegalArgumentException("feature names must not be null or blank; got " + featureNames);
      }
    }
    featureNames = List.copyOf(featureNames);
    if (new HashSet<>(featureNames).size() != featureNames.size()) {
      throw new IllegalArgumentException("feature names must be distinct; got " + featureNames);
    }
    int d = featureNames.size();
    mean = sized(mean, d, "mean");
    std = sized(std, d, "std");
    weights = sized(weights, d, "weights");
    for (int j = 0; j < d; j++) {
      if (!(std[j] > 0)) {
        throw new IllegalArgumentException("std of " + featureNames.get(j) + " must be positive; got " + std[j]);
      }
    }
    Checks.finite(bias, "bias");
    Checks.finite(lambda, "lambda");
    if (lambda < 0) {
      throw new IllegalArgumentException("lambda must not be negative; got " + lambda);
    }
  }

  private static double[] sized(double[] values, int d, String what) {
    Checks.finite(values, what);
    if (values.length != d) {
      throw new IllegalArgumentException(what + " has " + values.length + " entries for " + d + " features");
    }
    return values.clone();
  }

  @Override
  public double[] mean() {
    return mean.clone();
  }

  @Override
  public double[] std() {
    return std.clone();
  }

  @Override
  public double[] weights() {
    return weights.clone();
  }

  /** Log-odds of a positive outcome for raw (unstandardised) features {@code x}. */
  public double logit(double[] x) {
    double eta = bias;
    for (double t : terms(x)) {
      eta += t;
    }
    return eta;
  }

  /**
   * Each feature's term in {@link #logit}: weights[j] * (x[j] - mean[j]) / std[j], so that the
   * logit is the bias plus their sum. Terms in standardised units compare with each other.
   */
  public double[] terms(double[] x) {
    Checks.finite(x, "feature");
    if (x.length != weights.length) {
      throw new IllegalArgumentException(
          "expected " + weights.length + " features " + featureNames + "; got " + x.length);
    }
    double[] terms = new double[x.length];
    for (int j = 0; j < x.length; j++) {
      terms[j] = weights[j] * (x[j] - mean[j]) / std[j];
    }
    return terms;
  }

  /** Probability of a positive outcome for raw features {@code x}. */
  public double probability(double[] x) {
    return Sigmoid.logistic(logit(x));
  }

  /**
   * Weights per raw unit of each feature, weights[j] / std[j], for reports that speak in the
   * features' own units (a log-odds change per unit of the feature).
   */
  public double[] weightsInOriginalUnits() {
    double[] raw = new double[weights.length];
    for (int j = 0; j < raw.length; j++) {
      raw[j] = weights[j] / std[j];
    }
    return raw;
  }

  /** Log-odds at raw features all zero: bias - sum_j weights[j] * mean[j] / std[j]. */
  public double interceptInOriginalUnits() {
    double intercept = bias;
    for (int j = 0; j < weights.length; j++) {
      intercept -= weights[j] * mean[j] / std[j];
    }
    return intercept;
  }

  // A record compares arrays by identity; a model is a value, so compare contents.
  @Override
  public boolean equals(Object other) {
    return other instanceof LogisticModel m
        && featureNames.equals(m.featureNames)
        && Arrays.equals(mean, m.mean)
        && Arrays.equals(std, m.std)
        && Arrays.equals(weights, m.weights)
        && Double.compare(bias, m.bias) == 0
        && Double.compare(lambda, m.lambda) == 0;
  }

  @Override
  public int hashCode() {
    int h = featureNames.hashCode();
    h = 31 * h + Arrays.hashCode(mean);
    h = 31 * h + Arrays.hashCode(std);
    h = 31 * h + Arrays.hashCode(weights);
    return 31 * (31 * h + Double.hashCode(bias)) + Double.hashCode(lambda);
  }

  @Override
  public String toString() {
    return "LogisticModel[featureNames=" + featureNames + ", mean=" + Arrays.toString(mean) + ", std="
        + Arrays.toString(std) + ", weights=" + Arrays.toString(weights) + ", bias=" + bias + ", lambda="
        + lambda + "]";
  }
}
