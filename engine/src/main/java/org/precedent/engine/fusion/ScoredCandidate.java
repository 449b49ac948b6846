package org.precedent.engine.fusion;

import java.util.List;
import org.precedent.engine.rerank.AnswerScore;
import org.precedent.knowledge.retrieve.Candidate;

/**
 * A candidate answer with everything that scored it, for explanations.
 *
 * @param candidate   the BM25 candidate (group, BM25 score and rank, evidence)
 * @param rerank      the reranker's score of the group's canonical answer; null when the reranker
 *                    did not run for the question (the cascade leaves it out where the legs agree)
 * @param features    every feature of the candidate, BM25's, the reranker's and the dense leg's, in a fixed order
 *                    (the names are in each {@link SystemModel})
 * @param probability the fused model's P(this candidate is right), before calibration (fused
 *                    without the reranker's features when it did not run)
 */
public record ScoredCandidate(Candidate candidate, AnswerScore rerank, List<Double> features,
    double probability) {
  public ScoredCandidate {
    features = List.copyOf(features);
  }
}
