package org.precedent.knowledge.clean;

import java.util.Collections;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/**
 * The typed stand-ins that replace personal data. They are kept short and bracketed so that the
 * retrieval index treats each as one recognisable token and so that no redaction rule can match
 * its own output (none contains a digit or an {@code @}).
 */
public final class Placeholders {
  public static final String URL = "[URL]";
  public static final String EMAIL = "[EMAIL]";
  public static final String PHONE = "[PHONE]";
  public static final String CARD = "[CARD]";
  public static final String IBAN = "[IBAN]";
  public static final String ACCOUNT = "[ACCOUNT]";

  // Listed in the order the redactor applies its rules, so callers that print them read naturally.
  private static final Set<String> ALL =
      Collections.unmodifiableSet(new LinkedHashSet<>(List.of(URL, EMAIL, IBAN, CARD, ACCOUNT, PHONE)));

  private Placeholders() {}

  /**
   * The placeholders {@code text} holds, in the order the redaction rules run: an answer that holds
   * one lacks a detail that was redacted from it, and cannot be sent as written.
   */
  public static List<String> in(String text) {
    return ALL.stream().filter(text::contains).toList();
  }

  /** Every placeholder, in the order the redaction rules run; the set is unmodifiable. */
  public static Set<String> all() {
    return ALL;
  }
}
