package org.precedent.knowledge.retrieve;

import java.util.List;
import org.precedent.knowledge.group.AnswerGroup;

/**
 * A candidate answer for a new question: an answer group, scored from its past tickets.
 *
 * @param group    the answer group
 * @param rank     1 for the best candidate
 * @param score    the group's BM25 score: see {@link Aggregation}
 * @param hits     how many of the retrieved past tickets belong to the group
 * @param evidence its best-scoring past tickets, best first
 */
public record Candidate(AnswerGroup group, int rank, double score, int hits, List<Evidence> evidence) {
  public Candidate {
    evidence = List.copyOf(evidence);
  }
}
