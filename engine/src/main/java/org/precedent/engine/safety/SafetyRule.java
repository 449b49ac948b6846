package org.precedent.engine.safety;

import java.util.Objects;
import java.util.regex.Pattern;

/**
 * One term rule: when {@code pattern} finds a match in a question, the ticket goes to a person and the customer sees
 * {@code caution}.
 *
 * @param id short name, unique in a policy, lower case ({@code [a-z0-9][a-z0-9._-]*}), e.g. "wq-discoloured"
 * @param topic what kind of risk, same form as an id, e.g. "water-quality", "sewage", "fraud", "distress"
 * @param specificity whether the rule names the situation itself or only a sign of it; decides which of several
 *     matching rules comes first
 * @param pattern matched against the question as {@link SafetyPolicy#check} prepares it
 * @param caution the complete text for the customer, closing sentence included
 */
public record SafetyRule(String id, String topic, Specificity specificity, Pattern pattern, String caution) {

  private static final Pattern NAME = Pattern.compile("[a-z0-9][a-z0-9._-]*");

  /**
   * How much a match tells about what is happening. A sign (a smell, a colour, a charge the customer does not
   * recognise) is something several situations produce, so when a rule naming the situation (sewage flooding, a
   * stolen card) matches too, that situation is the better explanation of the sign, and its caution is the advice
   * that fits. Declared in that order: {@code SITUATION} first.
   */
  public enum Specificity {
    /** The words name what is happening: "sewage coming up", "smell gas", "my card was stolen", "sue". */
    SITUATION,
    /** The words name only a sign that several situations share: "smells awful", "brown water", "suspicious charge". */
    SIGN;

    /** The word a policy file uses for it. */
    public String word() {
      return name().toLowerCase(java.util.Locale.ROOT);
    }
  }

  public SafetyRule {
    requireName(id, "id");
    requireName(topic, "topic");
    Objects.requireNonNull(specificity, "specificity");
    Objects.requireNonNull(pattern, "pattern");
    if (caution == null || caution.isBlank()) {
      throw new IllegalArgumentException("rule " + id + ": caution must not be blank");
    }
  }

  static boolean isName(String s) {
    return s != null && NAME.matcher(s).matches();
  }

  private static void requireName(String value, String what) {
    if (!isName(value)) {
      throw new IllegalArgumentException(what + " must be lower-case letters, digits, '.', '_' or '-': " + value);
    }
  }
}
