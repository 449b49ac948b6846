package org.precedent.knowledge.clean;

/**
 * Cheap character scans that tell a rule its pattern cannot match, so the regular expression (far
 * slower per character) only runs on text that could hold what it looks for. Every test here is
 * a necessary condition of the rule's pattern, never a sufficient one.
 */
final class Scan {
  private Scan() {}

  /** Whether the text holds at least {@code n} ASCII digits. */
  static boolean hasDigits(CharSequence s, int n) {
    int count = 0;
    for (int i = 0; i < s.length() && count < n; i++) {
      char c = s.charAt(i);
      if (c >= '0' && c <= '9') {
        count++;
      }
    }
    return count >= n;
  }

  /** Whether two ASCII letters are directly followed by two digits somewhere: an IBAN's start. */
  static boolean hasLettersThenDigits(CharSequence s) {
    for (int i = 0; i + 3 < s.length(); i++) {
      if (isDigit(s.charAt(i + 2)) && isDigit(s.charAt(i + 3))
          && isLetter(s.charAt(i)) && isLetter(s.charAt(i + 1))) {
        return true;
      }
    }
    return false;
  }

  /** Whether the text contains the lower-case ASCII word, in any case. */
  static boolean containsIgnoreCase(String s, String lower) {
    int n = lower.length();
    for (int i = 0; i + n <= s.length(); i++) {
      if (s.regionMatches(true, i, lower, 0, n)) {
        return true;
      }
    }
    return false;
  }

  private static boolean isDigit(char c) {
    return c >= '0' && c <= '9';
  }

  private static boolean isLetter(char c) {
    return (c >= 'A' && c <= 'Z') || (c >= 'a' && c <= 'z');
  }
}
