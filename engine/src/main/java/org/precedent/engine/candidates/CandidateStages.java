package org.precedent.engine.candidates;

/**
 * The first two stages together, which every decision, fusion fit and evaluation starts from: the
 * candidates for a question and their scores.
 */
public record CandidateStages(CandidateSource source, CandidateScorer scorer) {
  /**
   * @param question       a cleaned question
   * @param excludedTicket a stored ticket to leave out (when asking its own question), or null
   */
  public CandidateScoring score(String question, String excludedTicket) {
    var retrieval = source.retrieve(question, excludedTicket);
    return new CandidateScoring(retrieval, scorer.score(question, retrieval.candidates()));
  }
}
