package org.precedent.engine.rerank.tokens;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Splits text into word-level tokens for the reranker.
 *
 * <p>Words are lower-cased; each punctuation mark is a token of its own, so "card?" and "card" share
 * the word. Redaction placeholders such as {@code [URL]}, {@code [EMAIL]}, {@code [PHONE]},
 * {@code [CARD]}, {@code [IBAN]} and {@code [ACCOUNT]} stay whole and upper-case: they stand for a kind of value, and splitting them
 * would make "[" and "]" the most common tokens of redacted data. A contraction such as "don't" stays
 * one word because splitting it gives the model nothing it can use.
 *
 * <p>A token is, at each position, the first of these that applies:
 * <ul>
 *   <li>a placeholder: {@code [}, an ASCII capital, ASCII capitals, digits or {@code _}, {@code ]};
 *   <li>a word: letters and digits, then any number of apostrophes ({@code '} or {@code ’}) each
 *       followed by one or more letters;
 *   <li>any other character that is not white space ({@code [ \t\n\u000B\f\r]}): one mark.
 * </ul>
 * Characters are Unicode code points. The scanner reads each character a bounded number of times
 * and never recurses, so its time is linear in the text and its stack use is constant, whatever
 * the text (a regular expression with a repeated group recurses once per repetition).
 */
public final class Tokenizer {

  /** Tokens of {@code text}; no limit on their number (callers truncate). */
  public List<String> tokenize(CharSequence text) {
    List<String> tokens = new ArrayList<>();
    if (text == null) {
      return tokens;
    }
    int n = text.length();
    int i = 0;
    while (i < n) {
      int c = Character.codePointAt(text, i);
      int end;
      if (isSpace(c)) {
        i += Character.charCount(c);
        continue;
      }
      if (c == '[' && (end = placeholderEnd(text, i)) > 0) {
        tokens.add(text.subSequence(i, end).toString());
      } else if (isLetterOrNumber(c)) {
        end = wordEnd(text, i);
        tokens.add(text.subSequence(i, end).toString().toLowerCase(Locale.ROOT)
            .replace('\u2019', '\''));
      } else {
        end = i + Character.charCount(c);
        tokens.add(text.subSequence(i, end).toString().toLowerCase(Locale.ROOT)
            .replace('\u2019', '\''));
      }
      i = end;
    }
    return tokens;
  }

  /** The end of the placeholder starting with the '[' at {@code start}, or -1 if there is none. */
  private static int placeholderEnd(CharSequence text, int start) {
    int n = text.length();
    int i = start + 1;
    if (i >= n || !isCapital(text.charAt(i))) {
      return -1;
    }
    for (i++; i < n; i++) {
      char c = text.charAt(i);
      if (c == ']') {
        return i + 1;
      }
      if (!isCapital(c) && !isDigit(c) && c != '_') {
        return -1;
      }
    }
    return -1;
  }

  /** The end of the word starting at {@code start}, a letter or number. */
  private static int wordEnd(CharSequence text, int start) {
    int n = text.length();
    int i = start;
    while (i < n) {
      int c = Character.codePointAt(text, i);
      if (!isLetterOrNumber(c)) {
        break;
      }
      i += Character.charCount(c);
    }
    // Apostrophe groups: an apostrophe counts only when a letter follows it.
    while (i < n && isApostrophe(text.charAt(i)) && i + 1 < n
        && Character.isLetter(Character.codePointAt(text, i + 1))) {
      i++;
      while (i < n) {
        int c = Character.codePointAt(text, i);
        if (!Character.isLetter(c)) {
          break;
        }
        i += Character.charCount(c);
      }
    }
    return i;
  }

  // The white space of java.util.regex's \s: ASCII only, so a no-break space is a mark.
  private static boolean isSpace(int c) {
    return c == ' ' || c == '\t' || c == '\n' || c == '\u000B' || c == '\f' || c == '\r';
  }

  // Unicode categories L and N, the \p{L} and \p{N} of java.util.regex.
  private static boolean isLetterOrNumber(int c) {
    if (Character.isLetter(c)) {
      return true;
    }
    int type = Character.getType(c);
    return type == Character.DECIMAL_DIGIT_NUMBER || type == Character.LETTER_NUMBER
        || type == Character.OTHER_NUMBER;
  }

  private static boolean isApostrophe(char c) {
    return c == '\'' || c == '\u2019';
  }

  private static boolean isCapital(char c) {
    return c >= 'A' && c <= 'Z';
  }

  private static boolean isDigit(char c) {
    return c >= '0' && c <= '9';
  }

  static boolean isPlaceholder(String token) {
    return token.length() > 2 && token.charAt(0) == '[' && token.charAt(token.length() - 1) == ']';
  }
}
