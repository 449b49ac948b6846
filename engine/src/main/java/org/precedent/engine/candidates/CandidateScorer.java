package org.precedent.engine.candidates;

import java.util.List;
import org.precedent.engine.rerank.AnswerScore;
import org.precedent.knowledge.retrieve.Candidate;

/** The second stage: a score for each candidate's answer as a reply to the question. */
public interface CandidateScorer {
  /** @return one score per candidate, in the candidates' order */
  List<AnswerScore> score(String question, List<Candidate> candidates);
}
