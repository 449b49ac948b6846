package org.precedent.engine.decide;

import java.util.HashMap;
import java.util.Map;
import java.util.Optional;
import org.precedent.knowledge.ticket.Category;

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
    perCategory.forEach((name, value) -> {
      categoryProblem(name).ifPresent(problem -> {
        throw new IllegalArgumentException("category '" + name + "' " + problem);
      });
      check(name, value);
    });
    Map<String, String> byKey = new HashMap<>();
    for (String name : perCategory.keySet()) {
      String other = byKey.put(Category.key(name), name);
      if (other != null) {
        throw new IllegalArgumentException("categories '" + other + "' and '" + name
            + "' differ only in case, and categories are compared without it: keep one");
      }
    }
  }

  public static Thresholds global(double threshold) {
    return new Thresholds(threshold, Map.of());
  }

  /** The threshold for a ticket of {@code category} (compared as {@link Category#key}). */
  public double forCategory(String category) {
    return own(category).map(perCategory::get).orElse(global);
  }

  /** The name of the category's own threshold, when it has one. */
  public Optional<String> own(String category) {
    String key = Category.key(category);
    if (key == null) {
      return Optional.empty();
    }
    return perCategory.keySet().stream().filter(name -> Category.key(name).equals(key)).findFirst();
  }

  /**
   * What keeps {@code name} from being a category a threshold can be set for, if anything.
   *
   * <p>Categories are the help desk's own names, so letters of any script, digits, punctuation,
   * symbols and spaces inside the name are all allowed ({@code =}, {@code :}, {@code #} and
   * backslashes too: the file escapes them). Refused are names no ticket can carry or that would
   * look like another name: empty ones, spaces at either end (a ticket's category is stripped on
   * ingest and on every question, so such a threshold would never apply), and control, format
   * (zero-width, direction marks), private-use, unassigned or unpaired surrogate characters and
   * line or paragraph separators, which are invisible on the threshold page.
   */
  public static Optional<String> categoryProblem(String name) {
    if (name == null || name.isEmpty()) {
      return Optional.of("is empty");
    }
    if (!name.strip().equals(name)) {
      return Optional.of("begins or ends with a space (ticket categories are compared without them)");
    }
    int[] codePoints = name.codePoints().toArray();
    for (int at = 0; at < codePoints.length; at++) {
      int cp = codePoints[at];
      switch (Character.getType(cp)) {
        case Character.CONTROL, Character.FORMAT, Character.SURROGATE, Character.PRIVATE_USE,
            Character.UNASSIGNED, Character.LINE_SEPARATOR, Character.PARAGRAPH_SEPARATOR -> {
          return Optional.of(String.format("has an invisible or control character (U+%04X) at "
              + "character %d; use letters, digits, punctuation, symbols and spaces", cp, at + 1));
        }
        default -> { }
      }
    }
    return Optional.empty();
  }

  private static void check(String name, double value) {
    // Above 1 means "never reply automatically", which a manager may want for a category.
    if (!(value >= 0 && value <= 1.0000001) && value != Double.POSITIVE_INFINITY) {
      throw new IllegalArgumentException("threshold " + name + " must be in [0, 1], got " + value);
    }
  }
}
