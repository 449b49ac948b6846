package org.precedent.engine.candidates;

import java.util.List;
import java.util.function.Supplier;
import org.precedent.engine.rerank.AnswerScore;
import org.precedent.engine.rerank.Scorer;
import org.precedent.knowledge.retrieve.Candidate;

/**
 * The sequence-to-sequence reranker's score of each candidate's canonical answer, in one batch.
 * The scorer is asked for when first needed, so one that loads on first use (a single question
 * from the command line that the faster legs settle) never loads the network at all.
 */
public final class RerankerScores implements CandidateScorer {
  private final Supplier<Scorer> scorer;

  public RerankerScores(Scorer scorer) {
    this(() -> scorer);
  }

  public RerankerScores(Supplier<Scorer> scorer) {
    this.scorer = scorer;
  }

  @Override
  public List<AnswerScore> score(String question, List<Candidate> candidates) {
    return scorer.get().score(question,
        candidates.stream().map(c -> c.group().canonical()).toList());
  }
}
