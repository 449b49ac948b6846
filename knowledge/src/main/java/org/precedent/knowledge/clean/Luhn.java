package org.precedent.knowledge.clean;

/**
 * The Luhn check ("modulus 10, double-add-double") that payment-card numbers carry in their last
 * digit, as specified in ISO/IEC 7812-1 Annex B. The redactor uses it so that an ordinary long
 * number (an order or meter serial) is not mistaken for a card unless its check digit agrees.
 */
public final class Luhn {
  private Luhn() {}

  /**
   * Whether the digits pass the Luhn check. Spaces and hyphens are ignored because card numbers are
   * usually written in groups; any other non-digit makes the answer false, as does having fewer
   * than two digits (a check digit needs something to check).
   */
  public static boolean isValid(CharSequence digits) {
    if (digits == null) {
      return false;
    }
    int sum = 0;
    int count = 0;
    boolean doubleIt = false; // the rightmost digit is the check digit and is not doubled
    for (int i = digits.length() - 1; i >= 0; i--) {
      char c = digits.charAt(i);
      if (c == ' ' || c == '-') {
        continue;
      }
      if (c < '0' || c > '9') {
        return false;
      }
      int d = c - '0';
      if (doubleIt) {
        d *= 2;
        if (d > 9) {
          d -= 9; // same as adding the two digits of the product
        }
      }
      sum += d;
      doubleIt = !doubleIt;
      count++;
    }
    return count >= 2 && sum % 10 == 0;
  }
}
