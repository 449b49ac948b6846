package org.precedent.engine.fusion;

import java.util.List;
import org.precedent.engine.rerank.AnswerScore;
import org.precedent.knowledge.retrieve.Candidate;

/**
 * A candidate answer with everything that scored it, for explanations.
 *
 * @param candidate   the BM25 candidate (group, BM25 score and rank, evidence)
 * @param rerank      the reranker's score of the group's canonical answer
 * @param features    the features fusion used, by name, in {@link ScoringSystem#FUSED} order
 * @param probability the fused model's P(this candidate is right), before calibration
 */
public record ScoredCandidate(Candidate candidate, AnswerScore rerank, List<Double> features,
    double probability) {
  public ScoredCandidate {
    features = List.copyOf(features);
  }
}
