package org.precedent.knowledge.clean;

import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Finds IBAN-shaped runs (two letters, two digits, then groups of four that may be separated by
 * single spaces) and redacts those that pass the mod-97 check. When a run fails, shorter runs that
 * end at an earlier group boundary are tried, because a number typed after an IBAN ("... 32 1234")
 * can be swallowed into the run.
 */
final class IbanRule implements Redactor.Rule {
  // Possessive group repetition: a run is read once, never re-split, so the cost stays linear.
  private static final Pattern CANDIDATE = Pattern.compile(
      "(?<![A-Za-z0-9])[A-Za-z]{2}[0-9]{2}(?: ?[A-Za-z0-9]{4}){2,8}+(?: ?[A-Za-z0-9]{1,4})?(?![A-Za-z0-9])");

  @Override
  public String apply(String text) {
    if (!Scan.hasLettersThenDigits(text)) {
      return text;
    }
    Matcher m = CANDIDATE.matcher(text);
    StringBuilder out = null;
    int copied = 0;
    while (m.find()) {
      int end = validEnd(text, m.start(), m.end());
      if (end < 0) {
        continue;
      }
      if (out == null) {
        out = new StringBuilder(text.length());
      }
      out.append(text, copied, m.start()).append(Placeholders.IBAN);
      copied = end;
    }
    if (out == null) {
      return text;
    }
    return out.append(text, copied, text.length()).toString();
  }

  /** The end of the longest valid IBAN starting at {@code start}, or -1 if there is none. */
  private static int validEnd(String text, int start, int end) {
    int e = end;
    while (e - start >= Iban.MIN_LENGTH) {
      if (Iban.isValid(text.substring(start, e))) {
        return e;
      }
      int space = text.lastIndexOf(' ', e - 1);
      if (space <= start) {
        return -1;
      }
      e = space;
    }
    return -1;
  }
}
