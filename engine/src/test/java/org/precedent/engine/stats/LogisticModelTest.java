package org.precedent.engine.stats;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

class LogisticModelTest {
  private static final List<String> NAMES = List.of("bm25", "reranker");

  private static LogisticModel model() {
    return new LogisticModel(NAMES, new double[] {2, -1}, new double[] {4, 0.5}, new double[] {1, 3}, 0.5, 0.01);
  }

  @Test
  void logitAndOriginalUnitsMatchAHandComputation() {
    // Hand-computed from the definition logit = bias + sum_j w_j (x_j - m_j) / s_j:
    // x = (1, 1): 0.5 + 1 * (1 - 2) / 4 + 3 * (1 + 1) / 0.5 = 0.5 - 0.25 + 12 = 12.25.
    // Original units: w_j / s_j = (0.25, 6); intercept 0.5 - 1 * 2 / 4 - 3 * (-1) / 0.5 = 6.
    LogisticModel model = model();
    assertEquals(12.25, model.logit(new double[] {1, 1}), 1e-12);
    assertArrayEquals(new double[] {0.25, 6}, model.weightsInOriginalUnits(), 1e-12);
    assertEquals(6.0, model.interceptInOriginalUnits(), 1e-12);
    assertEquals(6.0 + 0.25 * 3 + 6 * -2, model.logit(new double[] {3, -2}), 1e-12);
    // Logistic function of the log-odds (definition).
    assertEquals(1 / (1 + Math.exp(-12.25)), model.probability(new double[] {1, 1}), 1e-15);
  }

  @Test
  void survivesARoundTripThroughJson() throws Exception {
    // As a fusion model saves it: Jackson writes and reads the record by its components.
    com.fasterxml.jackson.databind.ObjectMapper json = new com.fasterxml.jackson.databind.ObjectMapper();
    LogisticModel model = model();
    assertEquals(model, json.readValue(json.writeValueAsBytes(model), LogisticModel.class));
  }

  @Test
  void arraysAreCopiedInAndOut() {
    double[] weights = {1, 3};
    List<String> names = new ArrayList<>(NAMES);
    LogisticModel model = new LogisticModel(names, new double[] {2, -1}, new double[] {4, 0.5}, weights, 0.5, 0);
    weights[0] = 99;
    names.set(0, "changed");
    model.weights()[1] = 99;
    assertArrayEquals(new double[] {1, 3}, model.weights());
    assertEquals(NAMES, model.featureNames());
  }

  @Test
  void refusesInconsistentParameters() {
    double[] two = {1, 1};
    assertThrows(IllegalArgumentException.class,
        () -> new LogisticModel(NAMES, two, new double[] {1, 0}, two, 0, 0));
    assertThrows(IllegalArgumentException.class,
        () -> new LogisticModel(NAMES, new double[] {1}, two, two, 0, 0));
    assertThrows(IllegalArgumentException.class,
        () -> new LogisticModel(List.of("a", "a"), two, two, two, 0, 0));
    assertThrows(IllegalArgumentException.class,
        () -> new LogisticModel(NAMES, two, two, two, Double.NaN, 0));
    assertThrows(IllegalArgumentException.class,
        () -> new LogisticModel(NAMES, two, two, two, 0, -0.1));
    assertThrows(IllegalArgumentException.class, () -> model().logit(new double[] {1}));
    assertThrows(IllegalArgumentException.class, () -> model().logit(new double[] {1, Double.NaN}));
  }
}
