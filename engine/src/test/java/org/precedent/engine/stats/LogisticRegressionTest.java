package org.precedent.engine.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

class LogisticRegressionTest {
  private static final List<String> ONE = List.of("x");
  private static final List<String> THREE = List.of("a", "b", "c");

  @Test
  void singleBinaryFeatureWithoutPenaltyGivesTheEmpiricalLogOdds() {
    // Derivation (maximum likelihood for logit P = b + w x, x in {0, 1}): the score equations are
    // sum_i (y_i - p_i) = 0 and sum_i x_i (y_i - p_i) = 0. The second sums over x = 1 only, so the
    // fitted rate there is the observed one, r1; subtracting it from the first gives r0 for x = 0.
    // Hence b = logit(r0) and w = logit(r1) - logit(r0). Here r0 = 3/10, r1 = 6/8:
    // logit(0.3) = log(3/7), logit(0.75) = log 3, so w = log 3 - log(3/7) = log 7.
    List<double[]> rows = new ArrayList<>();
    List<Boolean> outcomes = new ArrayList<>();
    for (int i = 0; i < 10; i++) {
      rows.add(new double[] {0});
      outcomes.add(i < 3);
    }
    for (int i = 0; i < 8; i++) {
      rows.add(new double[] {1});
      outcomes.add(i < 6);
    }
    LogisticModel model = LogisticRegression.fit(ONE, rows.toArray(double[][]::new), toArray(outcomes), 0.0);
    assertEquals(Math.log(7), model.weightsInOriginalUnits()[0], 1e-8);
    assertEquals(Math.log(3.0 / 7.0), model.interceptInOriginalUnits(), 1e-8);
    assertEquals(0.3, model.probability(new double[] {0}), 1e-9);
    assertEquals(0.75, model.probability(new double[] {1}), 1e-9);
  }

  @Test
  void penalisedGradientVanishesAtTheSolution() {
    // Optimality (KKT) condition of a smooth concave objective: its gradient is zero at the maximum.
    // Recomputed here independently: own standardisation (population standard deviation), own
    // gradient of (1/n) sum log-likelihood - (lambda/2)|beta|^2, and a central finite difference.
    Random random = new Random(11);
    double lambda = 0.3;
    int n = 200;
    double[][] x = new double[n][3];
    boolean[] y = new boolean[n];
    for (int i = 0; i < n; i++) {
      x[i] = new double[] {random.nextGaussian(), 5 + 3 * random.nextGaussian(), random.nextInt(4)};
      y[i] = random.nextDouble() < Sigmoid.logistic(0.8 * x[i][0] - 0.2 * (x[i][1] - 5) + 0.3 * x[i][2] - 0.5);
    }
    LogisticModel model = LogisticRegression.fit(THREE, x, y, lambda);
    double[][] z = new double[n][3];
    for (int j = 0; j < 3; j++) {
      double mean = 0;
      for (double[] row : x) {
        mean += row[j] / n;
      }
      double variance = 0;
      for (double[] row : x) {
        variance += (row[j] - mean) * (row[j] - mean) / n;
      }
      assertEquals(mean, model.mean()[j], 1e-12);
      assertEquals(Math.sqrt(variance), model.std()[j], 1e-12);
      for (int i = 0; i < n; i++) {
        z[i][j] = (x[i][j] - mean) / Math.sqrt(variance);
      }
    }
    double[] theta = {model.bias(), model.weights()[0], model.weights()[1], model.weights()[2]};
    double[] gradient = new double[4];
    for (int i = 0; i < n; i++) {
      double eta = theta[0] + theta[1] * z[i][0] + theta[2] * z[i][1] + theta[3] * z[i][2];
      double residual = (y[i] ? 1 : 0) - 1 / (1 + Math.exp(-eta));
      gradient[0] += residual / n;
      for (int j = 0; j < 3; j++) {
        gradient[j + 1] += residual * z[i][j] / n;
      }
    }
    for (int a = 0; a < 4; a++) {
      double penaltyGradient = a == 0 ? 0 : lambda * theta[a];
      assertEquals(0.0, gradient[a] - penaltyGradient, 1e-9, "coordinate " + a);
      double h = 1e-4;
      double[] up = theta.clone();
      double[] down = theta.clone();
      up[a] += h;
      down[a] -= h;
      double centre = objective(z, y, lambda, theta);
      double difference = (objective(z, y, lambda, up) - objective(z, y, lambda, down)) / (2 * h);
      assertEquals(0.0, difference, 1e-7, "finite difference, coordinate " + a);
      assertTrue(objective(z, y, lambda, up) <= centre && objective(z, y, lambda, down) <= centre);
    }
  }

  @Test
  void affineRescalingOfFeaturesDoesNotChangePredictions() {
    // Internal standardisation maps x and c x + d (c != 0) to the same z up to sign, and the L2
    // penalty is symmetric in sign, so the fitted probabilities must agree (follows from the design).
    Random random = new Random(5);
    int n = 150;
    double[][] x = new double[n][3];
    double[][] rescaled = new double[n][3];
    boolean[] y = new boolean[n];
    for (int i = 0; i < n; i++) {
      x[i] = new double[] {random.nextGaussian(), random.nextGaussian(), random.nextDouble()};
      rescaled[i] = rescale(x[i]);
      y[i] = random.nextDouble() < Sigmoid.logistic(x[i][0] - x[i][1] + 2 * x[i][2]);
    }
    LogisticModel plain = LogisticRegression.fit(THREE, x, y, 0.1);
    LogisticModel scaled = LogisticRegression.fit(THREE, rescaled, y, 0.1);
    for (int i = 0; i < n; i += 7) {
      assertEquals(plain.probability(x[i]), scaled.probability(rescaled[i]), 1e-9);
    }
  }

  private static double[] rescale(double[] row) {
    return new double[] {1000 * row[0] - 5, -0.01 * row[1] + 3, 1e6 * row[2]};
  }

  @Test
  void recoversTheGeneratingCoefficientsOnALargeSample() {
    // Consistency and asymptotic normality of the maximum-likelihood fit (Hastie, Tibshirani and
    // Friedman, ESL 2nd ed., section 4.4.2): beta-hat ~ N(beta, (X^T W X)^-1). The tolerance is 4.5
    // standard errors from that covariance, evaluated at the true coefficients on this sample; a
    // normal deviate exceeds it with probability about 7e-6.
    double[] truth = {-0.5, 1.2, -0.8, 0.05};
    Random random = new Random(2024);
    int n = 20000;
    double[][] x = new double[n][3];
    boolean[] y = new boolean[n];
    double[][] information = new double[4][4];
    for (int i = 0; i < n; i++) {
      x[i] = new double[] {random.nextGaussian(), 4 * random.nextDouble(), 10 + 20 * random.nextGaussian()};
      double eta = truth[0] + truth[1] * x[i][0] + truth[2] * x[i][1] + truth[3] * x[i][2];
      double p = Sigmoid.logistic(eta);
      y[i] = random.nextDouble() < p;
      double[] row = {1, x[i][0], x[i][1], x[i][2]};
      for (int a = 0; a < 4; a++) {
        for (int b = 0; b < 4; b++) {
          information[a][b] += p * (1 - p) * row[a] * row[b];
        }
      }
    }
    double[][] covariance = invert(information);
    LogisticModel model = LogisticRegression.fit(THREE, x, y, 0.0);
    double[] slopes = model.weightsInOriginalUnits();
    assertEquals(truth[0], model.interceptInOriginalUnits(), 4.5 * Math.sqrt(covariance[0][0]));
    for (int j = 0; j < 3; j++) {
      assertEquals(truth[j + 1], slopes[j], 4.5 * Math.sqrt(covariance[j + 1][j + 1]), "slope " + j);
    }
  }

  @Test
  void exampleWeightsActLikeRepeatedRows() {
    // Definition of case weights: weight k counts an example k times (common practice, e.g. glmnet).
    Random random = new Random(9);
    int n = 40;
    double[][] x = new double[n][3];
    boolean[] y = new boolean[n];
    double[] weights = new double[n];
    List<double[]> repeatedRows = new ArrayList<>();
    List<Boolean> repeatedOutcomes = new ArrayList<>();
    for (int i = 0; i < n; i++) {
      x[i] = new double[] {random.nextGaussian(), random.nextGaussian(), random.nextGaussian()};
      y[i] = random.nextBoolean();
      weights[i] = 1 + random.nextInt(3);
      for (int k = 0; k < weights[i]; k++) {
        repeatedRows.add(x[i]);
        repeatedOutcomes.add(y[i]);
      }
    }
    LogisticModel weighted = LogisticRegression.fit(THREE, x, y, weights, 0.05, 1e-12, 100);
    LogisticModel repeated =
        LogisticRegression.fit(THREE, repeatedRows.toArray(double[][]::new), toArray(repeatedOutcomes), 0.05);
    assertEquals(repeated.bias(), weighted.bias(), 1e-9);
    for (int j = 0; j < 3; j++) {
      assertEquals(repeated.weights()[j], weighted.weights()[j], 1e-9);
      assertEquals(repeated.mean()[j], weighted.mean()[j], 1e-12);
      assertEquals(repeated.std()[j], weighted.std()[j], 1e-12);
    }
  }

  @Test
  void penalisedObjectiveNeverDecreasesAlongTheNewtonSteps() {
    // The ascent guarantee of Newton's method with step halving (ESL 2nd ed., section 4.4.1 notes
    // that plain Newton can overshoot; halving restores monotone ascent). A heavy-tailed feature and
    // no penalty make the first full steps long.
    Random random = new Random(3);
    int n = 300;
    double[][] x = new double[n][1];
    boolean[] y = new boolean[n];
    for (int i = 0; i < n; i++) {
      double t = random.nextGaussian();
      x[i][0] = t * t * t;
      y[i] = random.nextDouble() < Sigmoid.logistic(1.5 * t + 0.5);
    }
    List<Double> trace = LogisticRegression.fitWithTrace(ONE, x, y, null, 0.0, 1e-12, 100).objectiveTrace();
    assertTrue(trace.size() > 2, "expected several Newton steps; got " + trace);
    for (int k = 1; k < trace.size(); k++) {
      assertTrue(trace.get(k) >= trace.get(k - 1), "objective fell at step " + k + ": " + trace);
    }
  }

  @Test
  void largerPenaltiesNeverLengthenTheWeights() {
    // For lambda1 < lambda2 with optima beta1, beta2 of L(beta) + lambda |beta|^2 / 2 (L convex):
    // optimality of each gives L(b1) + l1|b1|^2/2 <= L(b2) + l1|b2|^2/2 and the same with 2 and 1
    // swapped; adding them, (l1 - l2)(|b1|^2 - |b2|^2) <= 0, so |b2| <= |b1|. The unpenalised bias
    // keeps the mean fitted probability equal to the observed rate (score equation of the bias).
    Random random = new Random(17);
    int n = 120;
    double[][] x = new double[n][3];
    boolean[] y = new boolean[n];
    int positives = 0;
    for (int i = 0; i < n; i++) {
      x[i] = new double[] {random.nextGaussian(), random.nextGaussian(), random.nextGaussian()};
      y[i] = random.nextDouble() < Sigmoid.logistic(2 * x[i][0] - x[i][2] + 1);
      positives += y[i] ? 1 : 0;
    }
    double previous = Double.POSITIVE_INFINITY;
    for (double lambda : new double[] {0.0, 0.01, 0.1, 1, 10, 1000}) {
      LogisticModel model = LogisticRegression.fit(THREE, x, y, lambda);
      double norm = 0;
      for (double w : model.weights()) {
        norm += w * w;
      }
      assertTrue(norm <= previous + 1e-12, "lambda " + lambda + " lengthened the weights");
      previous = norm;
      double meanProbability = 0;
      for (double[] row : x) {
        meanProbability += model.probability(row) / n;
      }
      assertEquals((double) positives / n, meanProbability, 1e-9, "lambda " + lambda);
    }
  }

  private static double objective(double[][] z, boolean[] y, double lambda, double[] theta) {
    double f = 0;
    for (int i = 0; i < z.length; i++) {
      double eta = theta[0];
      for (int j = 0; j < z[i].length; j++) {
        eta += theta[j + 1] * z[i][j];
      }
      double p = 1 / (1 + Math.exp(-eta));
      f += (y[i] ? Math.log(p) : Math.log(1 - p)) / z.length;
    }
    for (int a = 1; a < theta.length; a++) {
      f -= 0.5 * lambda * theta[a] * theta[a];
    }
    return f;
  }

  /** Gauss-Jordan inverse with partial pivoting, for the small covariance matrix above. */
  private static double[][] invert(double[][] m) {
    int d = m.length;
    double[][] a = new double[d][2 * d];
    for (int i = 0; i < d; i++) {
      System.arraycopy(m[i], 0, a[i], 0, d);
      a[i][d + i] = 1;
    }
    for (int c = 0; c < d; c++) {
      int pivot = c;
      for (int r = c + 1; r < d; r++) {
        if (Math.abs(a[r][c]) > Math.abs(a[pivot][c])) {
          pivot = r;
        }
      }
      double[] swap = a[c];
      a[c] = a[pivot];
      a[pivot] = swap;
      double lead = a[c][c];
      for (int k = 0; k < 2 * d; k++) {
        a[c][k] /= lead;
      }
      for (int r = 0; r < d; r++) {
        if (r != c) {
          double factor = a[r][c];
          for (int k = 0; k < 2 * d; k++) {
            a[r][k] -= factor * a[c][k];
          }
        }
      }
    }
    double[][] inverse = new double[d][d];
    for (int i = 0; i < d; i++) {
      System.arraycopy(a[i], d, inverse[i], 0, d);
    }
    return inverse;
  }

  private static boolean[] toArray(List<Boolean> values) {
    boolean[] array = new boolean[values.size()];
    for (int i = 0; i < array.length; i++) {
      array[i] = values.get(i);
    }
    return array;
  }
}
