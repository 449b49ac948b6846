package org.precedent.engine.candidates;

import java.util.List;
import org.precedent.engine.rerank.AnswerScore;
import org.precedent.knowledge.retrieve.Candidate;
import org.precedent.knowledge.retrieve.Retrieval;

/**
 * A question's candidates and their scores: what {@link CandidateStages} gives every decision, fit
 * and evaluation.
 *
 * @param retrieval what the candidate source found
 * @param scores    the scorer's scores, in the order of {@code retrieval.candidates()}
 */
public record CandidateScoring(Retrieval retrieval, List<AnswerScore> scores) {
  public CandidateScoring {
    scores = List.copyOf(scores);
    if (scores.size() != retrieval.candidates().size()) {
      throw new IllegalArgumentException(scores.size() + " scores for "
          + retrieval.candidates().size() + " candidates");
    }
  }

  public List<Candidate> candidates() {
    return retrieval.candidates();
  }
}
