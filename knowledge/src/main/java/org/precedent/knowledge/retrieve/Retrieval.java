package org.precedent.knowledge.retrieve;

import java.util.List;

/**
 * What retrieval found for one new question: BM25's candidates, then those only the dense leg found.
 *
 * @param question   the cleaned question searched
 * @param queryTerms its analysed terms, in order of first use
 * @param truncated  true when the question had more distinct terms than a query takes
 * @param candidates candidate answer groups, best first
 * @param references one-off past tickets that matched: for agents to read, never automatic replies
 * @param vector     the question's unit vector the dense leg searched with, or null without one
 */
public record Retrieval(String question, List<String> queryTerms, boolean truncated,
    List<Candidate> candidates, List<Evidence> references, float[] vector) {
  public Retrieval {
    queryTerms = List.copyOf(queryTerms);
    candidates = List.copyOf(candidates);
    references = List.copyOf(references);
    vector = vector == null ? null : vector.clone();
  }

  @Override
  public float[] vector() {
    return vector == null ? null : vector.clone();
  }
}
