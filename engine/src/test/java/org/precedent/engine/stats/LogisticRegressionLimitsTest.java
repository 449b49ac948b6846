package org.precedent.engine.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

/** Degenerate inputs: constant features, separable classes, and data that must be refused. */
class LogisticRegressionLimitsTest {
  private static final List<String> ONE = List.of("x");

  @Test
  void aConstantFeatureGetsUnitScaleAndNoWeight() {
    // The feature carries no information: its gradient is zero at every point, so Newton leaves its
    // weight at the starting 0 (follows from the score equations).
    double[][] x = {{1, 7}, {2, 7}, {3, 7}, {4, 7}, {5, 7}, {6, 7}};
    boolean[] y = {false, true, false, true, true, false};
    for (double lambda : new double[] {0.0, 0.5}) {
      LogisticModel model = LogisticRegression.fit(List.of("x", "flat"), x, y, lambda);
      assertEquals(1.0, model.std()[1]);
      assertEquals(7.0, model.mean()[1], 1e-12);
      assertEquals(0.0, model.weights()[1], 1e-12);
    }
  }

  @Test
  void separableDataNeedAPenalty() {
    // Without a penalty the maximum likelihood is approached only as the weights grow without bound
    // (Albert and Anderson 1984, Biometrika 71, on separation in logistic regression).
    double[][] x = {{-2}, {-1}, {-0.5}, {0.5}, {1}, {2}};
    boolean[] y = {false, false, false, true, true, true};
    assertThrows(IllegalStateException.class, () -> LogisticRegression.fit(ONE, x, y, 0.0));
    // Quasi-separation: every example with x = 1 is positive.
    double[][] quasi = {{0}, {0}, {0}, {0}, {1}, {1}};
    boolean[] outcomes = {true, false, false, true, true, true};
    assertThrows(IllegalStateException.class, () -> LogisticRegression.fit(ONE, quasi, outcomes, 0.0));
    LogisticModel penalised = LogisticRegression.fit(ONE, x, y);
    assertTrue(penalised.weights()[0] > 0 && Double.isFinite(penalised.weights()[0]));
  }

  @Test
  void refusesUnusableInput() {
    double[][] good = {{1}, {2}};
    boolean[] both = {true, false};
    assertThrows(IllegalArgumentException.class, () -> LogisticRegression.fit(ONE, new double[0][], new boolean[0]));
    assertThrows(IllegalArgumentException.class,
        () -> LogisticRegression.fit(ONE, new double[][] {{1}, {2, 3}}, both));
    assertThrows(IllegalArgumentException.class,
        () -> LogisticRegression.fit(ONE, new double[][] {{1}, {Double.NaN}}, both));
    assertThrows(IllegalArgumentException.class,
        () -> LogisticRegression.fit(ONE, new double[][] {{1}, {Double.POSITIVE_INFINITY}}, both));
    assertThrows(IllegalArgumentException.class,
        () -> LogisticRegression.fit(ONE, good, new boolean[] {true, true}));
    assertThrows(IllegalArgumentException.class, () -> LogisticRegression.fit(ONE, good, new boolean[] {true}));
    assertThrows(IllegalArgumentException.class, () -> LogisticRegression.fit(ONE, good, both, -1));
    assertThrows(IllegalArgumentException.class, () -> LogisticRegression.fit(List.of("a", "b"), good, both));
    // A class present only with weight zero counts as absent.
    assertThrows(IllegalArgumentException.class,
        () -> LogisticRegression.fit(ONE, good, both, new double[] {1, 0}, 0.01, 1e-9, 50));
    assertThrows(IllegalArgumentException.class,
        () -> LogisticRegression.fit(ONE, good, both, new double[] {1, -1}, 0.01, 1e-9, 50));
  }
}
