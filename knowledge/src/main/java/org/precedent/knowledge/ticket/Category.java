package org.precedent.knowledge.ticket;

import java.text.Normalizer;
import java.util.Locale;

/**
 * A ticket's category as every door reads it (ingest, triage, the service's questions and queue):
 * one rule here, so a category means the same wherever it arrives.
 */
public final class Category {
  private Category() {}

  /**
   * The category as kept and shown: Unicode NFC (the same letters typed on two systems compare
   * equal), without spaces at either end; null when absent or blank.
   */
  public static String normalise(String raw) {
    if (raw == null) {
      return null;
    }
    String s = Normalizer.normalize(raw, Normalizer.Form.NFC).strip();
    return s.isEmpty() ? null : s;
  }

  /**
   * What categories are compared by: the normalised name in lower case, so "Billing" and
   * "billing" are one category for thresholds and human-only rules; null when absent.
   */
  public static String key(String category) {
    String s = normalise(category);
    return s == null ? null : s.toLowerCase(Locale.ROOT);
  }
}
