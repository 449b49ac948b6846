package org.precedent.knowledge.retrieve;

import java.util.List;
import org.precedent.knowledge.group.AnswerGroup;

/**
 * A candidate answer for a new question: an answer group, scored from its past tickets.
 *
 * @param group    the answer group
 * @param rank     1 for the best candidate
 * @param score    the group's BM25 score: see {@link Aggregation}; 0 when BM25 did not find it
 * @param hits     how many of the retrieved past tickets belong to the group
 * @param evidence its best-scoring past tickets, best first (for a candidate only the dense leg
 *                 found, its nearest past tickets, with BM25 score 0)
 * @param proximity what the dense leg says of it ({@link Proximity#NONE} without one)
 */
public record Candidate(AnswerGroup group, int rank, double score, int hits, List<Evidence> evidence,
    Proximity proximity) {
  public Candidate {
    evidence = List.copyOf(evidence);
    java.util.Objects.requireNonNull(proximity, "proximity");
  }
}
