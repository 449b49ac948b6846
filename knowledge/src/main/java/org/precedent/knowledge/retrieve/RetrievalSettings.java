package org.precedent.knowledge.retrieve;

/**
 * How deep retrieval looks and how much it returns.
 *
 * @param depth       past tickets retrieved by BM25 before grouping
 * @param candidates  candidate answer groups returned at most
 * @param evidence    evidence tickets kept per candidate
 * @param references  one-off reference tickets returned at most
 * @param aggregation how ticket scores become group scores
 */
public record RetrievalSettings(int depth, int candidates, int evidence, int references,
    Aggregation aggregation) {
  public RetrievalSettings {
    if (depth < 1 || candidates < 1 || evidence < 1 || references < 0) {
      throw new IllegalArgumentException("depth, candidates and evidence must be at least 1, "
          + "references at least 0; got " + depth + ", " + candidates + ", " + evidence + ", "
          + references);
    }
    if (aggregation == null) {
      throw new IllegalArgumentException("aggregation is required");
    }
  }

  /** 100 tickets deep, 10 candidates with 3 evidence tickets each, 3 references. */
  public static RetrievalSettings standard() {
    return new RetrievalSettings(100, 10, 3, 3, Aggregation.MAX_PLUS_SUPPORT);
  }

  public RetrievalSettings withCandidates(int n) {
    return new RetrievalSettings(depth, n, evidence, references, aggregation);
  }

  public RetrievalSettings withAggregation(Aggregation a) {
    return new RetrievalSettings(depth, candidates, evidence, references, a);
  }
}
