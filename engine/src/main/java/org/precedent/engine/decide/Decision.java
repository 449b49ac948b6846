package org.precedent.engine.decide;

import java.util.List;
import org.precedent.engine.explain.Explanation;
import org.precedent.engine.fusion.ScoredCandidate;
import org.precedent.engine.safety.SafetyFinding;

/**
 * What Precedent decided for one question, with everything that explains it.
 *
 * @param outcome     reply automatically, or hand off
 * @param reason      why it was handed off; null for a reply
 * @param question    the question as cleaned and redacted
 * @param answerGroup the best answer group's id, or null when there is no candidate
 * @param reply       the automatic reply (the group's canonical answer); null for a hand-off
 * @param confidence  calibrated P(best answer is right)
 * @param threshold   the threshold in force for this question's category
 * @param safety      the safety rule that fired, or null
 * @param caution     what the customer should do now, shown with a hand-off; null otherwise
 * @param candidates  candidates in fused order, with their scores and features
 * @param why         why, as a tree of named contributions; its root's detail is the decision in
 *                    one or two sentences ({@link #explanation()})
 * @param truncated   the question was longer than the models take and was cut
 */
public record Decision(Outcome outcome, HandOffReason reason, String question, String answerGroup,
    String reply, double confidence, double threshold, SafetyFinding safety, String caution,
    List<ScoredCandidate> candidates, Explanation why, boolean truncated) {
  public Decision {
    candidates = List.copyOf(candidates);
    if ((outcome == Outcome.REPLY) != (reason == null)) {
      throw new IllegalArgumentException("a reply has no hand-off reason, a hand-off has one");
    }
  }

  /** The decision in one or two sentences: the root of {@link #why()}. */
  public String explanation() {
    return why.detail();
  }
}
