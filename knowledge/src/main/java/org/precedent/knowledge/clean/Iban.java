package org.precedent.knowledge.clean;

import java.util.Locale;

/**
 * Structure and check-digit test for International Bank Account Numbers (ISO 13616-1), whose two
 * check digits follow ISO/IEC 7064 MOD 97-10. Only the country-independent rules are checked;
 * per-country lengths from the registry are deliberately not, so a new country needs no update.
 */
public final class Iban {
  // ISO 13616-1: at most 34 characters. The shortest IBAN in use is Norway's 15 (from memory);
  // accepting shorter runs would only add false positives in free text.
  static final int MIN_LENGTH = 15;
  static final int MAX_LENGTH = 34;

  private Iban() {}

  /**
   * Whether the text is a well-formed IBAN with correct check digits. The paper ("print") format
   * with spaces between groups of four and lower-case letters are accepted, as customers type both.
   */
  public static boolean isValid(String iban) {
    if (iban == null) {
      return false;
    }
    String s = compact(iban);
    if (s.length() < MIN_LENGTH || s.length() > MAX_LENGTH || !wellFormed(s)) {
      return false;
    }
    // ISO 7064 MOD 97-10 only yields check digits 02..98, so 00, 01 and 99 are never issued.
    int check = (s.charAt(2) - '0') * 10 + (s.charAt(3) - '0');
    return check >= 2 && check <= 98 && mod97(s) == 1;
  }

  /** The IBAN without spaces, upper-cased: the electronic format. */
  static String compact(String iban) {
    StringBuilder b = new StringBuilder(iban.length());
    for (int i = 0; i < iban.length(); i++) {
      char c = iban.charAt(i);
      if (c != ' ') {
        b.append(c);
      }
    }
    return b.toString().toUpperCase(Locale.ROOT);
  }

  private static boolean wellFormed(String s) {
    if (!isLetter(s.charAt(0)) || !isLetter(s.charAt(1))) {
      return false;
    }
    if (!isDigit(s.charAt(2)) || !isDigit(s.charAt(3))) {
      return false;
    }
    for (int i = 4; i < s.length(); i++) {
      if (!isLetter(s.charAt(i)) && !isDigit(s.charAt(i))) {
        return false;
      }
    }
    return true;
  }

  /**
   * The remainder mod 97 of the number formed by moving the first four characters to the end and
   * writing each letter as two digits (A=10 ... Z=35). Done digit by digit so no big integer is
   * built; the result equals the remainder of the whole number.
   */
  static int mod97(String compact) {
    int n = compact.length();
    int rem = 0;
    for (int k = 0; k < n; k++) {
      char c = compact.charAt((k + 4) % n);
      if (isDigit(c)) {
        rem = (rem * 10 + (c - '0')) % 97;
      } else {
        rem = (rem * 100 + (c - 'A' + 10)) % 97;
      }
    }
    return rem;
  }

  private static boolean isLetter(char c) {
    return c >= 'A' && c <= 'Z';
  }

  private static boolean isDigit(char c) {
    return c >= '0' && c <= '9';
  }
}
