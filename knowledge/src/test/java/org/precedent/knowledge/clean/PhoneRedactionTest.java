package org.precedent.knowledge.clean;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class PhoneRedactionTest {
  private final TextCleaner cleaner = TextCleaner.standard();

  @ParameterizedTest
  @CsvSource(delimiter = '|', value = {
      // Ofcom reserves these ranges for TV and radio drama ("Telephone numbers for drama", Ofcom;
      // ranges from memory): 01632 960000-960999, 07700 900000-900999, 020 7946 0000-0999,
      // 0113 496 0000-0999 (Leeds), 0161 496 0000-0999 (Manchester).
      "Call me on 01632 960456 please|Call me on [PHONE] please",
      "Call me on 01632 960 456 please|Call me on [PHONE] please",
      "Call me on (01632) 960456 please|Call me on [PHONE] please",
      "Mobile 07700 900123.|Mobile [PHONE].",
      "Mobile 07700900123|Mobile [PHONE]",
      "Office 020 7946 0000, ext 12|Office [PHONE], ext 12",
      "Tel:0113 496 0555|Tel:[PHONE]",
      "Manchester office 0161-496-0999|Manchester office [PHONE]"
  })
  void redactsUkNationalNumbersInOfcomDramaRanges(String in, String out) {
    assertEquals(out, cleaner.redact(in));
  }

  @ParameterizedTest
  @CsvSource(delimiter = '|', value = {
      // ITU-T Recommendation E.164: '+', country code, at most 15 digits in all. Numbers are the
      // Ofcom drama ranges above written internationally.
      "Ring +44 20 7946 0000 today|Ring [PHONE] today",
      "Ring +44 (0)20 7946 0018 today|Ring [PHONE] today",
      "Ring +447700900123.|Ring [PHONE].",
      "Ring +44-1632-960-999|Ring [PHONE]",
      "15 digits +123456789012345 ok|15 digits [PHONE] ok"
  })
  void redactsInternationalNumbersUpToFifteenDigits(String in, String out) {
    assertEquals(out, cleaner.redact(in));
  }

  @Test
  void leavesSixteenDigitsAfterPlusAlone() {
    // ITU-T E.164 caps international numbers at 15 digits, so 16 is not a phone number (and a
    // run after '+' is never taken for a card either).
    assertEquals("code +1234567890123456 end", cleaner.redact("code +1234567890123456 end"));
  }

  @ParameterizedTest
  @CsvSource(delimiter = '|', value = {
      // NANP: 555-0100 to 555-0199 are set aside for fictional use (NANPA; from memory).
      "US office (555) 555-0123.|US office [PHONE].",
      "US office (555)555-0142|US office [PHONE]",
      "US office 555-555-0199|US office [PHONE]",
      "US office 555.555.0100|US office [PHONE]",
      "Toll free 1-800-555-0175|Toll free [PHONE]"
  })
  void redactsNorthAmericanNumbers(String in, String out) {
    assertEquals(out, cleaner.redact(in));
  }
}
