package org.precedent.engine.decide;

import java.util.Map;

/**
 * The confidence a question needs for an automatic reply: one global threshold, optionally
 * overridden per ticket category.
 *
 * @param global      threshold for every category without its own
 * @param perCategory thresholds by category
 */
public record Thresholds(double global, Map<String, Double> perCategory) {
  public Thresholds {
    check("global", global);
    perCategory = Map.copyOf(perCategory);
    perCategory.forEach(Thresholds::check);
  }

  public static Thresholds global(double threshold) {
    return new Thresholds(threshold, Map.of());
  }

  public double forCategory(String category) {
    return category == null ? global : perCategory.getOrDefault(category, global);
  }

  private static void check(String name, double value) {
    // Above 1 means "never reply automatically", which a manager may want for a category.
    if (!(value >= 0 && value <= 1.0000001) && value != Double.POSITIVE_INFINITY) {
      throw new IllegalArgumentException("threshold " + name + " must be in [0, 1], got " + value);
    }
  }
}
