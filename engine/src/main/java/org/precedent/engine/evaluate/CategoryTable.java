package org.precedent.engine.evaluate;

import java.util.List;
import java.util.Objects;

/**
 * Per-category results of one system at one threshold.
 *
 * @param threshold the threshold the rows were measured at
 * @param basis     where that threshold came from, so the report never passes off an unguaranteed
 *                  threshold as a guaranteed one
 * @param rows      one row per category, sorted by name
 */
public record CategoryTable(double threshold, Basis basis, List<CategoryRow> rows) {
  /** Where the threshold of a category table came from. */
  public enum Basis {
    /** The guaranteed threshold recommendation. */
    RECOMMENDED,
    /** No guarantee was possible; the caller named the threshold. */
    GIVEN,
    /**
     * No guarantee was possible and none was named: the threshold with the largest coverage whose
     * measured precision reaches the target, without any allowance for sampling error.
     */
    MEASURED
  }

  public CategoryTable {
    Objects.requireNonNull(basis, "basis");
    rows = List.copyOf(rows);
  }
}
