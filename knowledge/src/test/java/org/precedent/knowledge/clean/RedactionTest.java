package org.precedent.knowledge.clean;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class RedactionTest {
  private final TextCleaner cleaner = TextCleaner.standard();

  @ParameterizedTest
  @CsvSource(delimiter = '|', value = {
      "Write to dana.fairley+bills@example.co.uk today|Write to [EMAIL] today",
      "(tom_99@mail.example.com)|([EMAIL])",
      "Send it to priya@example.org.|Send it to [EMAIL].",
      "no address here @ all|no address here @ all"
  })
  void redactsEmailAddresses(String in, String out) {
    assertEquals(out, cleaner.redact(in));
  }

  @ParameterizedTest
  @CsvSource(delimiter = '|', value = {
      // IBAN examples from ISO 13616 / the SWIFT IBAN Registry (from memory; see IbanTest).
      "Pay from GB82 WEST 1234 5698 7654 32 please|Pay from [IBAN] please",
      "IBAN:DE89370400440532013000.|IBAN:[IBAN].",
      "iban fr14 2004 1010 0505 0001 3m02 606 ok|iban [IBAN] ok",
      "Pay from GB82 WEST 1234 5698 7654 32 1234 now|Pay from [IBAN] 1234 now",
      // one digit changed: fails mod 97, so it is left (and it is no card or phone either)
      "Pay from GB82 WEST 1234 5698 7654 33 please|Pay from GB82 WEST 1234 5698 7654 33 please"
  })
  void redactsIbansThatPassMod97(String in, String out) {
    assertEquals(out, cleaner.redact(in));
  }

  @ParameterizedTest
  @CsvSource(delimiter = '|', value = {
      // Issuer test card numbers: common practice, from memory (see LuhnTest).
      "Card 4111 1111 1111 1111 was declined|Card [CARD] was declined",
      "Card 4111-1111-1111-1111 was declined|Card [CARD] was declined",
      "Card 4111111111111111.|Card [CARD].",
      "Amex 3782 822463 10005 ok|Amex [CARD] ok",
      "On 2026-03-12 4111 1111 1111 1111 was charged|On 2026-03-12 [CARD] was charged",
      // fails Luhn: an order number, not a card
      "Order 4111 1111 1111 1112 shipped|Order 4111 1111 1111 1112 shipped",
      "Order 1234567890123 shipped|Order 1234567890123 shipped"
  })
  void redactsCardNumbersOnlyWhenLuhnPasses(String in, String out) {
    assertEquals(out, cleaner.redact(in));
  }

  @ParameterizedTest
  @CsvSource(delimiter = '|', value = {
      "Account TVW12345678 is mine|Account [ACCOUNT] is mine",
      "Account tvw-12345678 is mine|Account [ACCOUNT] is mine",
      "Account TVW 12345678, thanks|Account [ACCOUNT], thanks",
      "Account TVW1234567 is short|Account TVW1234567 is short",
      "Account TVW 12345678 and card 4111 1111 1111 1111|Account [ACCOUNT] and card [CARD]"
  })
  void redactsDemoAccountNumbers(String in, String out) {
    assertEquals(out, cleaner.redact(in));
  }

  @Test
  void redactsEveryKindInOneMessage() {
    String in = "I'm tom@example.com, account TVW-00012345, card 5555 5555 5555 4444, "
        + "IBAN GB29 NWBK 6016 1331 9268 19, mobile 07700 900321.";
    assertEquals("I'm [EMAIL], account [ACCOUNT], card [CARD], IBAN [IBAN], mobile [PHONE].",
        cleaner.redact(in));
  }

  @Test
  void redactingTwiceChangesNothing() {
    String once = cleaner.redact("tom@example.com 07700 900321 4111 1111 1111 1111 TVW12345678");
    assertEquals(once, cleaner.redact(once));
  }

  @Test
  void listsEveryPlaceholderInRuleOrder() {
    assertEquals(List.of("[URL]", "[EMAIL]", "[IBAN]", "[CARD]", "[ACCOUNT]", "[PHONE]"),
        List.copyOf(Placeholders.all()));
  }
}
