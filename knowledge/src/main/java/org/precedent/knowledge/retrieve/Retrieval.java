package org.precedent.knowledge.retrieve;

import java.util.List;

/**
 * What BM25 retrieval found for one new question.
 *
 * @param question   the cleaned question searched
 * @param queryTerms its analysed terms, in order of first use
 * @param truncated  true when the question had more distinct terms than a query takes
 * @param candidates candidate answer groups, best first
 * @param references one-off past tickets that matched: for agents to read, never automatic replies
 */
public record Retrieval(String question, List<String> queryTerms, boolean truncated,
    List<Candidate> candidates, List<Evidence> references) {
  public Retrieval {
    queryTerms = List.copyOf(queryTerms);
    candidates = List.copyOf(candidates);
    references = List.copyOf(references);
  }
}
