package org.precedent.engine.decide;

import java.util.List;
import java.util.Optional;
import org.precedent.engine.safety.SafetyFinding;
import org.precedent.engine.safety.SafetyPolicy;
import org.precedent.knowledge.clean.Placeholders;
import org.precedent.knowledge.group.AnswerGroup;
import org.precedent.knowledge.group.Slots;

/**
 * The gate in front of every automatic reply: the safety rules (the question's words, the ticket's
 * category, the best answer's group and its own category), and an answer that still lacks a
 * redacted detail. The advisor and the evaluation both ask it, so that what an evaluation counts
 * as handed off is what the service hands off.
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

  /**
   * The placeholders in the answer that would be sent: when there are any, it is not sent
   * automatically (the advisor hands off with {@link HandOffReason#ANSWER_INCOMPLETE}).
   */
  public static List<String> missingDetails(AnswerGroup best) {
    return best == null ? List.of() : Placeholders.in(best.canonical());
  }

  /**
   * The slots of the best answer's template (knowledge.group.Slots): when there are any, the
   * answer needs this customer's details and is not sent automatically ({@link
   * HandOffReason#NEEDS_CUSTOMER_DETAILS}).
   */
  public static List<String> slots(AnswerGroup best) {
    return best == null ? List.of() : Slots.names(best.template());
  }

  /** Whether the service would hand the question off whatever the confidence. */
  public static boolean handsOff(SafetyPolicy safety, String question, String category,
      AnswerGroup best) {
    return (safety != null && check(safety, question, category, best).isPresent())
        || !missingDetails(best).isEmpty() || !slots(best).isEmpty();
  }
}
