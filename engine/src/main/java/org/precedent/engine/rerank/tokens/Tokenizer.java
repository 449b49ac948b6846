package org.precedent.engine.rerank.tokens;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Splits text into word-level tokens for the reranker.
 *
 * <p>Words are lower-cased; each punctuation mark is a token of its own, so "card?" and "card" share
 * the word. Redaction placeholders such as {@code [EMAIL]}, {@code [PHONE]}, {@code [CARD]}, {@code [IBAN]}
 * and {@code [ACCOUNT]} stay whole and upper-case: they stand for a kind of value, and splitting them
 * would make "[" and "]" the most common tokens of redacted data. A contraction such as "don't" stays
 * one word because splitting it gives the model nothing it can use.
 */
public final class Tokenizer {

  private static final Pattern TOKEN = Pattern.compile(
      "\\[[A-Z][A-Z0-9_]*\\]"                   // placeholder
          + "|[\\p{L}\\p{N}]+(?:['\u2019][\\p{L}]+)*" // word, with inner apostrophes
          + "|[^\\s\\p{L}\\p{N}]");                  // one punctuation mark or symbol

  /** Tokens of {@code text}; no limit on their number (callers truncate). */
  public List<String> tokenize(String text) {
    List<String> tokens = new ArrayList<>();
    if (text == null) {
      return tokens;
    }
    Matcher m = TOKEN.matcher(text);
    while (m.find()) {
      String t = m.group();
      tokens.add(isPlaceholder(t) ? t : t.toLowerCase(Locale.ROOT).replace('\u2019', '\''));
    }
    return tokens;
  }

  static boolean isPlaceholder(String token) {
    return token.length() > 2 && token.charAt(0) == '[' && token.charAt(token.length() - 1) == ']';
  }
}
