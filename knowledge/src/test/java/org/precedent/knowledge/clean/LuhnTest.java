package org.precedent.knowledge.clean;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class LuhnTest {

  @Test
  void acceptsTheTextbookExample() {
    // Source: Wikipedia, "Luhn algorithm", worked example 7992739871 with check digit 3 (from
    // memory). The algorithm itself is H. P. Luhn, US patent 2,950,048 (1960), and ISO/IEC 7812-1
    // Annex B; the number is not quoted from either of those.
    assertTrue(Luhn.isValid("79927398713"));
  }

  @ParameterizedTest
  @ValueSource(strings = {
      "4111 1111 1111 1111", // 16-digit test card
      "5555 5555 5555 4444", // 16-digit test card
      "3782 822463 10005",   // 15-digit test card, printed 4-6-5
      "6011-1111-1111-1117", // 16-digit test card, hyphenated
      "4222222222222"        // 13-digit test card
  })
  void acceptsIssuerTestCardNumbers(String card) {
    // Common practice, no single standard: payment processors publish these as test numbers that
    // pass Luhn but belong to no account (quoted from memory).
    assertTrue(Luhn.isValid(card));
  }

  @Test
  void rejectsEverySingleDigitChange() {
    // Luhn detects every single-digit substitution, because doubling with digit sum is a
    // permutation of 0..9 (Wikipedia, "Luhn algorithm", from memory); checked exhaustively here.
    String valid = "79927398713";
    for (int pos = 0; pos < valid.length(); pos++) {
      for (char d = '0'; d <= '9'; d++) {
        if (d == valid.charAt(pos)) {
          continue;
        }
        String changed = valid.substring(0, pos) + d + valid.substring(pos + 1);
        assertFalse(Luhn.isValid(changed), changed);
      }
    }
  }

  @Test
  void rejectsAKnownCardWithItsLastDigitChanged() {
    assertFalse(Luhn.isValid("4111 1111 1111 1112"));
  }

  @Test
  void rejectsLettersEmptyInputAndNull() {
    assertFalse(Luhn.isValid("7992739871X"));
    assertFalse(Luhn.isValid(""));
    assertFalse(Luhn.isValid("0"));
    assertFalse(Luhn.isValid(null));
  }
}
