package org.precedent.engine.candidates;

import java.util.List;
import org.precedent.engine.rerank.AnswerScore;
import org.precedent.engine.rerank.Scorer;
import org.precedent.knowledge.retrieve.Candidate;

/** The sequence-to-sequence reranker's score of each candidate's canonical answer, in one batch. */
public final class RerankerScores implements CandidateScorer {
  private final Scorer scorer;

  public RerankerScores(Scorer scorer) {
    this.scorer = scorer;
  }

  @Override
  public List<AnswerScore> score(String question, List<Candidate> candidates) {
    return scorer.score(question, candidates.stream().map(c -> c.group().canonical()).toList());
  }
}
