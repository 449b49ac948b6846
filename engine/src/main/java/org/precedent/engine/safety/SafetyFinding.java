package org.precedent.engine.safety;

import java.util.List;
import java.util.Objects;

/**
 * Why a ticket must go to a person.
 *
 * <p>When several term rules match, {@code matches} holds every one of them in precedence order (see
 * {@link SafetyPolicy#check}), and the first gives {@code ruleId}, {@code topic} and {@code matched}. The caution
 * then holds the text of every matched topic, the first match's first, each once, and the closing sentence once at
 * the end: the agent and the customer see every caution that applies, most specific first.
 *
 * @param ruleId the rule that fired first in precedence; for a human-only group or category,
 *     {@code "human-only-group"} or {@code "human-only-category"}
 * @param topic that rule's topic; {@code "human-only"} for a human-only group or category
 * @param matched the text that rule matched, or the group or category id
 * @param kind what fired
 * @param caution the text for the customer
 * @param matches every term rule that matched, in precedence order; empty for a human-only group or category
 */
public record SafetyFinding(String ruleId, String topic, String matched, Kind kind, String caution,
    List<Match> matches) {

  /** What made the ticket human-only. */
  public enum Kind {
    /** A rule's pattern matched the question. */
    TERM,
    /** The proposed answer group is marked human-only. */
    HUMAN_ONLY_GROUP,
    /** The ticket's category is marked human-only. */
    HUMAN_ONLY_CATEGORY
  }

  /**
   * One term rule that matched.
   *
   * @param ruleId the rule's id
   * @param topic the rule's topic
   * @param specificity the rule's specificity
   * @param matched the first text in the question the rule matched
   * @param caution the rule's own caution, closing sentence included
   */
  public record Match(String ruleId, String topic, SafetyRule.Specificity specificity, String matched,
      String caution) {
    public Match {
      requireText(ruleId, "ruleId");
      requireText(topic, "topic");
      Objects.requireNonNull(specificity, "specificity");
      requireText(matched, "matched");
      requireText(caution, "caution");
    }
  }

  public SafetyFinding {
    requireText(ruleId, "ruleId");
    requireText(topic, "topic");
    requireText(matched, "matched");
    Objects.requireNonNull(kind, "kind");
    requireText(caution, "caution");
    matches = List.copyOf(matches);
    if (kind == Kind.TERM && !matches.isEmpty() && !matches.get(0).ruleId().equals(ruleId)) {
      throw new IllegalArgumentException("the first match must be the rule reported: " + ruleId);
    }
  }

  /** A finding with no list of matches: a human-only group or category, or a single rule. */
  public SafetyFinding(String ruleId, String topic, String matched, Kind kind, String caution) {
    this(ruleId, topic, matched, kind, caution, List.of());
  }

  /** The topics of all matches, in precedence order, each once. */
  public List<String> topics() {
    if (matches.isEmpty()) {
      return List.of(topic);
    }
    return matches.stream().map(Match::topic).distinct().toList();
  }

  private static void requireText(String value, String what) {
    if (value == null || value.isBlank()) {
      throw new IllegalArgumentException(what + " must not be blank");
    }
  }
}
