package org.precedent.engine.candidates;

import org.precedent.knowledge.retrieve.Retrieval;

/** The first stage of a decision: the candidate answers for a cleaned question. */
public interface CandidateSource {
  /**
   * @param question       a cleaned question
   * @param excludedTicket a stored ticket to leave out (when asking its own question), or null
   */
  Retrieval retrieve(String question, String excludedTicket);
}
