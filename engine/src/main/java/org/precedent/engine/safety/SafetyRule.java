package org.precedent.engine.safety;

import java.util.Objects;
import java.util.regex.Pattern;

/**
 * One term rule: when {@code pattern} finds a match in a question, the ticket goes to a person and the customer sees
 * {@code caution}.
 *
 * @param id short name, unique in a policy, lower case ({@code [a-z0-9][a-z0-9._-]*}), e.g. "wq-discoloured"
 * @param topic what kind of risk, same form as an id, e.g. "water-quality", "sewage", "burst-main", "gas",
 *     "electricity", "health", "legal", "money-dispute"
 * @param pattern matched against the question as {@link SafetyPolicy#check} prepares it
 * @param caution the complete text for the customer, closing sentence included
 */
public record SafetyRule(String id, String topic, Pattern pattern, String caution) {

  private static final Pattern NAME = Pattern.compile("[a-z0-9][a-z0-9._-]*");

  public SafetyRule {
    requireName(id, "id");
    requireName(topic, "topic");
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
