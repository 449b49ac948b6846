package org.precedent.knowledge.clean;

import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * Ingesting a team's history means cleaning every ticket, so 100k tickets must take seconds. The
 * bound is generous (shared build machines); catastrophic backtracking would blow it by minutes.
 */
@Tag("slow")
class CleaningSpeedTest {
  private final TextCleaner cleaner = TextCleaner.standard();

  @Test
  void cleansOneHundredThousandTicketsInSeconds() {
    String[] mails = {
        "Hi Dana,\n\nMy reading on 12/03/2026 was 04821 and the bill is £61.00. Card 4111 1111 1111 1111."
            + " Call 07700 900123.\n\nThanks,\nPriya\n\nOn Tue, 3 Mar 2026, Care <care@example.com> wrote:\n"
            + "> Please send a reading.\n> Kind regards\n> Sam",
        "Dear Sir/Madam,\nIBAN GB82 WEST 1234 5698 7654 32, account TVW12345678, ref 48213."
            + " 1 2 3 4 5 6 7 8 9 10 11 12 13 14 15 16 17 18 19 20 aaaaaaaaaaaaaaaaaaaaaaaaaaaa@"
            + "\nRegards\nTom Fairley\n-- \nTom\n+44 20 7946 0000",
        "Hi,\nOur meter (serial 14M123456) reads 0482 m3 but the bill of 1,250.00 says 0610.\n"
            + "Pay from GB29 NWBK 6016 1331 9268 19 instead.\nBest wishes\nPriya\n07700 900456"
    };
    assertTimeoutPreemptively(Duration.ofSeconds(60), () -> {
      long chars = 0;
      for (int i = 0; i < 100_000; i++) {
        chars += cleaner.cleanQuestion(mails[i % mails.length] + " #" + i).length();
      }
      assertTrue(chars > 0);
    });
  }

  @Test
  void cleansAdversarialInputInLinearTime() {
    // Inputs shaped to provoke backtracking or quadratic scans in the rules; 20k-40k characters.
    String[] inputs = {
        "1 ".repeat(20_000), "1-2-3-".repeat(5_000), "+1 ".repeat(10_000), "a@".repeat(10_000),
        "x".repeat(100) + "@" + "b-".repeat(10_000), "01632 ".repeat(5_000), "GB82 ".repeat(5_000),
        "4111 ".repeat(5_000), "On " + "x ".repeat(10_000), "Hi " + "Dana ".repeat(5_000) + ",",
        "a\n".repeat(10_000) + "Kind regards\n" + "Sam\n".repeat(1_000), ">\n".repeat(10_000)
    };
    assertTimeoutPreemptively(Duration.ofSeconds(30), () -> {
      for (String input : inputs) {
        cleaner.cleanQuestion(input);
        cleaner.cleanReply(input);
      }
    });
  }
}
