package org.precedent.engine.explain;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * Why a decision or a score came out as it did, as a tree of named contributions: each node has a
 * value, a phrase saying what it is, and the parts it is made of (a search engine explains a score
 * in the same shape). The decision's one-line text is its root's phrase.
 *
 * @param name   what this part is, for instance "confidence", "fused logit" or a feature's name
 * @param value  its value, or null for a part that is a fact rather than a number
 * @param detail one phrase saying what the value means
 * @param parts  what it is made of; for a sum, the terms, largest effect first
 */
public record Explanation(String name, Double value, String detail, List<Explanation> parts) {
  public Explanation {
    Objects.requireNonNull(name, "name");
    Objects.requireNonNull(detail, "detail");
    if (value != null && !Double.isFinite(value)) {
      throw new IllegalArgumentException(name + ": value " + value + " is not finite");
    }
    parts = List.copyOf(parts);
  }

  public static Explanation of(String name, double value, String detail) {
    return new Explanation(name, value, detail, List.of());
  }

  public static Explanation fact(String name, String detail) {
    return new Explanation(name, null, detail, List.of());
  }

  /** A sum, with its terms ordered by the size of their effect, largest first. */
  public static Explanation sum(String name, String detail, List<Explanation> terms) {
    List<Explanation> ordered = new ArrayList<>(terms);
    ordered.sort(Comparator.comparingDouble((Explanation e) -> e.value == null ? 0
        : -Math.abs(e.value)));
    return new Explanation(name, ordered.stream().mapToDouble(e -> e.value == null ? 0 : e.value)
        .sum(), detail, ordered);
  }

  /** The first part with this name, searching depth first. */
  public Optional<Explanation> find(String partName) {
    if (name.equals(partName)) {
      return Optional.of(this);
    }
    for (Explanation p : parts) {
      var found = p.find(partName);
      if (found.isPresent()) {
        return found;
      }
    }
    return Optional.empty();
  }
}
