package org.precedent.knowledge.clean;

/**
 * Whitespace normalisation: trimmed lines, single spaces, at most one blank line between
 * paragraphs, no zero-width characters. Paragraphs are kept because replies are shown to agents
 * as written. Written as one pass over the characters because it runs on every ticket twice.
 */
final class Whitespace {
  private Whitespace() {}

  /** The lines of a normalised text, whose only line break is '\n' (a fast single-char split). */
  static String[] lines(String normalised) {
    return normalised.split("\n", -1);
  }

  static String normalise(String text) {
    StringBuilder out = new StringBuilder(text.length());
    boolean lineOpen = false; // a visible character of the current line has been written
    boolean blankPending = false;
    boolean spacePending = false;
    int n = text.length();
    for (int i = 0; i < n; i++) {
      char c = text.charAt(i);
      if (isLineBreak(c)) {
        if (c == '\r' && i + 1 < n && text.charAt(i + 1) == '\n') {
          i++; // CR LF is one break, as in \R
        }
        blankPending = !lineOpen && out.length() > 0;
        lineOpen = false;
        spacePending = false;
      } else if (isHorizontalSpace(c)) {
        spacePending = lineOpen;
      } else if (!isZeroWidth(c)) {
        if (!lineOpen) {
          if (out.length() > 0) {
            out.append(blankPending ? "\n\n" : "\n");
          }
          lineOpen = true;
        } else if (spacePending) {
          out.append(' ');
        }
        spacePending = false;
        out.append(c);
      }
    }
    return out.toString();
  }

  // The characters of \R.
  private static boolean isLineBreak(char c) {
    return c == '\n' || c == '\r' || c == '\u000B' || c == '\f' || c == '\u0085'
        || c == '\u2028' || c == '\u2029';
  }

  // The characters of \h.
  private static boolean isHorizontalSpace(char c) {
    return c == ' ' || c == '\t' || c == '\u00A0' || c == '\u1680' || c == '\u180E'
        || (c >= '\u2000' && c <= '\u200A') || c == '\u202F' || c == '\u205F' || c == '\u3000';
  }

  private static boolean isZeroWidth(char c) {
    return c == '\u200B' || c == '\u200C' || c == '\u200D' || c == '\u2060' || c == '\uFEFF';
  }
}
