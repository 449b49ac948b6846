package org.precedent.engine.decide;

import java.util.Optional;
import org.precedent.engine.safety.SafetyFinding;
import org.precedent.engine.safety.SafetyPolicy;
import org.precedent.knowledge.group.AnswerGroup;

/**
 * The safety gate in front of every automatic reply: the question's words, the ticket's category,
 * and the best answer (its group and its own category). The advisor and the evaluation both ask it,
 * so that what an evaluation counts as handed off is what the service hands off.
 */
public final class SafetyGate {
  private SafetyGate() {}

  /**
   * @param question a cleaned question
   * @param category the ticket's category, or null
   * @param best     the answer that would be sent, or null when there is none
   * @return the rule that hands the question to a person, if one does
   */
  public static Optional<SafetyFinding> check(SafetyPolicy safety, String question,
      String category, AnswerGroup best) {
    Optional<SafetyFinding> finding = safety.check(question, category,
        best == null ? null : best.id());
    if (finding.isEmpty() && best != null && best.category() != null) {
      // The best answer's own category counts too: a safety answer is for people to send.
      finding = safety.check(question, best.category(), best.id());
    }
    return finding;
  }
}
