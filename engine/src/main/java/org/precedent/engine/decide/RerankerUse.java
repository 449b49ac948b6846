package org.precedent.engine.decide;

import java.util.Arrays;
import java.util.Locale;

/**
 * When a decision runs the reranker, a setting ({@code -Dprecedent.reranker=...}): it is most of a
 * decision's time, and with a dense leg beside BM25 it changes the answer for few questions. The
 * default runs it only where BM25, the dense leg and their fusion disagree on the first answer
 * ({@code ScoringSystem.CASCADE}); {@code evaluate} shows all three ways side by side.
 */
public enum RerankerUse {
  /** Every question: the decision is fused over every feature. */
  ALWAYS("always"),
  /**
   * Only where the faster legs disagree on the first answer; a model without a dense leg has no
   * second leg, so it runs for every question there.
   */
  ON_DISAGREEMENT("on-disagreement"),
  /** Never: decisions are fused from BM25 and the dense leg only (BM25 alone without one). */
  NEVER("never");

  /** The system property that sets it. */
  public static final String PROPERTY = "precedent.reranker";

  private final String setting;

  RerankerUse(String setting) {
    this.setting = setting;
  }

  /** The setting's spelling. */
  public String setting() {
    return setting;
  }

  /**
   * @param value the setting, blank for the default
   * @throws IllegalArgumentException naming the setting and its values
   */
  public static RerankerUse named(String value) {
    if (value == null || value.isBlank()) {
      return ON_DISAGREEMENT;
    }
    String v = value.strip().toLowerCase(Locale.ROOT);
    return Arrays.stream(values()).filter(u -> u.setting.equals(v)).findFirst()
        .orElseThrow(() -> new IllegalArgumentException("-D" + PROPERTY + "=" + value.strip()
            + " is not a setting: use one of " + Arrays.stream(values())
                .map(RerankerUse::setting).toList()));
  }

  /** What {@code -Dprecedent.reranker} says (the default when unset). */
  public static RerankerUse fromSetting() {
    return named(System.getProperty(PROPERTY));
  }
}
