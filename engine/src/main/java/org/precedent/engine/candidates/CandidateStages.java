package org.precedent.engine.candidates;

import org.precedent.knowledge.retrieve.Retrieval;

/**
 * The first two stages together, which every decision, fusion fit and evaluation starts from: the
 * candidates for a question and their scores, by the reranker and (when the source embedded the
 * question) by the dense leg's classifier.
 */
public record CandidateStages(CandidateSource source, CandidateScorer scorer,
    GroupPosterior posterior) {
  public CandidateStages {
    java.util.Objects.requireNonNull(posterior, "posterior");
  }

  /** BM25-only stages: no classifier. */
  public CandidateStages(CandidateSource source, CandidateScorer scorer) {
    this(source, scorer, GroupPosterior.NONE);
  }

  /**
   * @param question       a cleaned question
   * @param excludedTicket a stored ticket to leave out (when asking its own question), or null
   */
  public CandidateScoring score(String question, String excludedTicket) {
    Retrieval retrieval = source.retrieve(question, excludedTicket);
    float[] vector = retrieval.vector();
    return new CandidateScoring(retrieval, scorer.score(question, retrieval.candidates()),
        vector == null ? GroupPosterior.NONE.probabilities(null, retrieval.candidates())
            : posterior.probabilities(vector, retrieval.candidates()));
  }
}
