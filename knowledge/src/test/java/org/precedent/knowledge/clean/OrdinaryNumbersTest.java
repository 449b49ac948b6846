package org.precedent.knowledge.clean;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Numbers that help desks see every day and that carry no personal data. Redacting them would
 * destroy what makes two tickets alike ("reading 04821", "ref 48213"), so none may change.
 * The cases are common practice in help-desk text, not taken from a standard.
 */
class OrdinaryNumbersTest {
  private final TextCleaner cleaner = TextCleaner.standard();

  @ParameterizedTest
  @ValueSource(strings = {
      // dates
      "Reading taken on 12/03/2026 at 09:30",
      "Payment due 2026-03-12",
      "Paid on 3 March 2026",
      "Period 01/01/2026-31/03/2026",
      "Visit booked for 12.03.2026",
      "Letter dated 03-12-2026",
      // amounts
      "Refund of £42.50 is pending",
      "Balance 1,250.00 overdue",
      "Charged $30 twice",
      "Total £1,632.96 for the year",
      // ticket and reference numbers
      "See ref 48213",
      "Ticket #48213 reopened",
      "Case T-100234 escalated",
      "Invoice 2026-0042 attached",
      // meter readings
      "Meter reading 04821",
      "reading 0482 m3",
      "Reading 048213 today",
      "Readings 04821 05113 on two meters",
      "Serial 14M123456",
      // postcodes
      "Postcode RG1 8DN",
      "Postcode SW1A 1AA",
      "Postcode EC1A 1BB and DN55 1PT",
      // years, times, short numbers
      "Built in 1998, moved in 2026",
      "Open 09:30-17:00 weekdays",
      "Order 12 of 30, 3 left",
      "Version 1.2.3",
      "Temperature +5 today"
  })
  void leavesOrdinaryNumbersAlone(String text) {
    assertEquals(text, cleaner.redact(text));
    assertEquals(text, cleaner.cleanQuestion(text));
  }
}
