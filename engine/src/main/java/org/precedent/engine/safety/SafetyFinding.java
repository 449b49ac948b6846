package org.precedent.engine.safety;

import java.util.Objects;

/**
 * Why a ticket must go to a person.
 *
 * @param ruleId the rule that fired; for a human-only group or category, {@code "human-only-group"} or
 *     {@code "human-only-category"}
 * @param topic the rule's topic; {@code "human-only"} for a human-only group or category
 * @param matched the text the rule matched, or the group or category id
 * @param kind what fired
 * @param caution the text for the customer
 */
public record SafetyFinding(String ruleId, String topic, String matched, Kind kind, String caution) {

  /** What made the ticket human-only. */
  public enum Kind {
    /** A rule's pattern matched the question. */
    TERM,
    /** The proposed answer group is marked human-only. */
    HUMAN_ONLY_GROUP,
    /** The ticket's category is marked human-only. */
    HUMAN_ONLY_CATEGORY
  }

  public SafetyFinding {
    requireText(ruleId, "ruleId");
    requireText(topic, "topic");
    requireText(matched, "matched");
    Objects.requireNonNull(kind, "kind");
    requireText(caution, "caution");
  }

  private static void requireText(String value, String what) {
    if (value == null || value.isBlank()) {
      throw new IllegalArgumentException(what + " must not be blank");
    }
  }
}
