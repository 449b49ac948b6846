package org.precedent.knowledge.clean;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class IbanTest {

  @Test
  void acceptsTheStandardsFictitiousBritishExample() {
    // Source: the fictitious IBAN used to illustrate ISO 13616 (also the worked example of the
    // Wikipedia article "International Bank Account Number"); from memory, not copied from the
    // standard's text.
    assertTrue(Iban.isValid("GB82 WEST 1234 5698 7654 32"));
    assertTrue(Iban.isValid("GB82WEST12345698765432"));
  }

  @Test
  void computesTheMod97StepsOfTheBritishExample() {
    // ISO 7064 MOD 97-10 as used by ISO 13616, for GB82WEST12345698765432 (steps recomputed here):
    //   move the first four characters to the end:  WEST12345698765432GB82
    //   letters to numbers (A=10 ... Z=35): W=32 E=14 S=28 T=29 G=16 B=11
    //   N = 3214282912345698765432161182
    //   piecewise: 321428291 mod 97 = 70; 702345698 mod 97 = 29; 297654321 mod 97 = 24;
    //              2461182 mod 97 = 1   -> N mod 97 = 1, so the check digits 82 are right.
    assertEquals(1, Iban.mod97("GB82WEST12345698765432"));
    assertEquals(70, 321428291 % 97);
    assertEquals(29, 702345698 % 97);
    assertEquals(24, 297654321 % 97);
    assertEquals(1, 2461182 % 97);
  }

  @ParameterizedTest
  @ValueSource(strings = {
      "DE89 3704 0044 0532 0130 00",     // SWIFT IBAN Registry, example for Germany (from memory)
      "FR14 2004 1010 0505 0001 3M02 606", // SWIFT IBAN Registry, example for France (from memory)
      "GB29 NWBK 6016 1331 9268 19",     // SWIFT IBAN Registry, example for the UK (from memory)
      "fr1420041010050500013m02606"      // same French example typed in lower case, no spaces
  })
  void acceptsRegistryExamples(String iban) {
    assertTrue(Iban.isValid(iban));
  }

  @ParameterizedTest
  @ValueSource(strings = {
      "GB82 WEST 1234 5698 7654 33",  // last digit changed
      "GB82 WEST 1234 5698 7654 23",  // last two digits swapped
      "DE88 3704 0044 0532 0130 00",  // check digits changed
      "GB82 WEST 1234 5698 7654",     // truncated
      "GB82 WEST 1234 5698 7654 32 1" // digit appended
  })
  void rejectsTamperedNumbers(String iban) {
    // ISO 7064 MOD 97-10 detects all single substitutions and adjacent transpositions (from memory).
    assertFalse(Iban.isValid(iban));
  }

  @Test
  void rejectsMalformedInput() {
    assertFalse(Iban.isValid(null));
    assertFalse(Iban.isValid(""));
    assertFalse(Iban.isValid("1282WEST12345698765432")); // country must be letters
    assertFalse(Iban.isValid("GB8XWEST12345698765432")); // check digits must be digits
    assertFalse(Iban.isValid("GB82-WEST-1234-5698-7654-32")); // only spaces may separate groups
    assertFalse(Iban.isValid("GB82WEST1234569876543212345678901234")); // over 34 (ISO 13616-1)
  }
}
