package org.precedent.knowledge.embed;

import java.util.List;
import java.util.Optional;

/**
 * Which sentence encoder a data directory's knowledge is embedded with: a setting, {@code
 * -Dprecedent.encoder=NAME}, whose value {@code none} keeps BM25-only operation for a team that
 * cannot ship the model. The default is bge-small-en-v1.5 (quantized): the dense leg it feeds lifts
 * fused top-1 on CLINC150 banking ({@code ClincBankingDecisionTest} measures both ways) and on the
 * demo ({@code benchmark figures}), for one model run per question.
 */
public final class Encoders {
  /** The system property that chooses the encoder. */
  public static final String PROPERTY = "precedent.encoder";
  /** The setting's value for no dense leg at all. */
  public static final String NONE = "none";
  /** The encoders this build can run, the default first. */
  public static final List<SentenceEncoder.Model> KNOWN = List.of(SentenceEncoder.BGE_SMALL_EN_V15_Q);

  private Encoders() {}

  /**
   * The encoder a setting names: blank for the default (the first of {@link #KNOWN}), {@link #NONE}
   * for none.
   *
   * @throws IllegalArgumentException naming the setting and the encoders there are
   */
  public static Optional<SentenceEncoder.Model> named(String setting) {
    if (setting == null || setting.isBlank()) {
      return Optional.of(KNOWN.get(0));
    }
    String name = setting.strip();
    if (name.equals(NONE)) {
      return Optional.empty();
    }
    return Optional.of(KNOWN.stream().filter(m -> m.name().equals(name)).findFirst()
        .orElseThrow(() -> new IllegalArgumentException("encoder '" + name + "' is not one this "
            + "build runs: " + KNOWN.stream().map(SentenceEncoder.Model::name).toList() + " or '"
            + NONE + "' for BM25 only")));
  }

  /** The encoder {@code -Dprecedent.encoder} names (the default when it is not set). */
  public static Optional<SentenceEncoder.Model> fromSetting() {
    return named(System.getProperty(PROPERTY));
  }
}
