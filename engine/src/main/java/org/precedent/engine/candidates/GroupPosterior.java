package org.precedent.engine.candidates;

import java.util.Collections;
import java.util.List;
import org.precedent.knowledge.retrieve.Candidate;

/**
 * A probability for each candidate's answer group given the question's vector: the dense leg's
 * classifier, beside the reranker's score of the same candidates.
 */
public interface GroupPosterior {
  /** No classifier: every candidate gets 0, so fusion learns nothing from it. */
  GroupPosterior NONE = (vector, candidates) -> Collections.nCopies(candidates.size(), 0.0);

  /**
   * @param vector     the question's unit vector (never null)
   * @param candidates the candidates, in retrieval order
   * @return one probability per candidate, in the candidates' order (0 for a group it never saw)
   */
  List<Double> probabilities(float[] vector, List<Candidate> candidates);
}
