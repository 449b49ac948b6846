package org.precedent.engine.candidates;

import java.util.Collections;
import java.util.List;
import org.precedent.engine.rerank.AnswerScore;
import org.precedent.knowledge.retrieve.Candidate;
import org.precedent.knowledge.retrieve.Retrieval;

/**
 * A question's candidates and their scores: what {@link CandidateStages} gives every decision, fit
 * and evaluation.
 *
 * @param retrieval what the candidate source found
 * @param scores    the scorer's scores, in the order of {@code retrieval.candidates()}; null when
 *                  the reranker was not run for this question (see {@link #reranked()})
 * @param posterior the dense leg's classifier probability of each candidate's group, same order
 *                  (all 0 without a dense leg)
 */
public record CandidateScoring(Retrieval retrieval, List<AnswerScore> scores,
    List<Double> posterior) {
  public CandidateScoring {
    scores = scores == null ? null : List.copyOf(scores);
    posterior = List.copyOf(posterior);
    int n = retrieval.candidates().size();
    if ((scores != null && scores.size() != n) || posterior.size() != n) {
      throw new IllegalArgumentException((scores == null ? "no" : scores.size()) + " scores and "
          + posterior.size() + " probabilities for " + n + " candidates");
    }
  }

  /** Scored candidates without a dense leg. */
  public CandidateScoring(Retrieval retrieval, List<AnswerScore> scores) {
    this(retrieval, scores, Collections.nCopies(retrieval.candidates().size(), 0.0));
  }

  public List<Candidate> candidates() {
    return retrieval.candidates();
  }

  /** Whether the reranker scored the candidates. */
  public boolean reranked() {
    return scores != null;
  }

  /** The same candidates with the reranker's scores added. */
  public CandidateScoring withScores(List<AnswerScore> reranker) {
    return new CandidateScoring(retrieval, reranker, posterior);
  }

  /** Whether the question, or the text the reranker read of it, was cut to fit. */
  public boolean truncated() {
    return retrieval.truncated()
        || (scores != null && scores.stream().anyMatch(AnswerScore::questionTruncated));
  }
}
