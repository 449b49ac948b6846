package org.precedent.knowledge.clean;

/** Placeholder until the cleaning package lands: whitespace normalisation only. */
public final class TextCleaner {
  private TextCleaner() {}

  public static TextCleaner standard() {
    return new TextCleaner();
  }

  public String cleanQuestion(String raw) {
    return raw.strip().replaceAll("\\s+", " ");
  }

  public String cleanReply(String raw) {
    return raw.strip().replaceAll("\\s+", " ");
  }

  public String redact(String text) {
    return text;
  }
}
