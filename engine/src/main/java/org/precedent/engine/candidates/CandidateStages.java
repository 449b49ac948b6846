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
    return rerank(question, retrieve(question, excludedTicket));
  }

  /**
   * The first stage and the dense leg's classifier, without the reranker: what a decision that
   * runs the reranker only where the legs disagree looks at first.
   */
  public CandidateScoring retrieve(String question, String excludedTicket) {
    Retrieval retrieval = source.retrieve(question, excludedTicket);
    float[] vector = retrieval.vector();
    return new CandidateScoring(retrieval, null,
        vector == null ? GroupPosterior.NONE.probabilities(null, retrieval.candidates())
            : posterior.probabilities(vector, retrieval.candidates()));
  }

  /** Adds the reranker's scores to what {@link #retrieve} found (the same when already there). */
  public CandidateScoring rerank(String question, CandidateScoring retrieved) {
    return retrieved.reranked() ? retrieved
        : retrieved.withScores(scorer.score(question, retrieved.candidates()));
  }
}
