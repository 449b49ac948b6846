package org.precedent.knowledge.clean;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** Property: cleaning an already clean text changes nothing, so re-ingesting is harmless. */
class IdempotenceTest {
  private final TextCleaner cleaner = TextCleaner.standard();

  @ParameterizedTest
  @ValueSource(strings = {
      "Hi Dana,\n\nMy bill is £61.00, card 4111 1111 1111 1111.\n\nThanks,\nPriya",
      "Hi,\nThanks!\nTom",
      "Hello, Hi Dana, the tap drips.\nKind regards,\nTom\nTel 01632  960456 or 07700 900123 anytime",
      "Thanks for the quick reply.\nMeter fixed now\nThanks,\nTom",
      "Why? Thanks, Priya\n\nOn Tue, 3 Mar 2026, Care <care@example.com> wrote:\n> hello",
      "> all quoted",
      "Dear Sir/Madam,\nIBAN GB82 WEST 1234 5698 7654 32, account TVW 12345678.\nRegards\nTom",
      ""
  })
  void cleaningTwiceEqualsCleaningOnce(String raw) {
    String once = cleaner.cleanQuestion(raw);
    assertEquals(once, cleaner.cleanQuestion(once));
    String reply = cleaner.cleanReply(raw);
    assertEquals(reply, cleaner.cleanReply(reply));
  }

  @Test
  void cleaningTwiceEqualsCleaningOnceForGeneratedMails() {
    // Mails assembled from typical parts with a fixed seed, so a failure is reproducible.
    List<String> openings = List.of("Hi Dana,", "Hello there", "Good morning!", "Hope you're well.",
        "Dear Sir/Madam,", "Hi, ", "Thank you for contacting us.", "");
    List<String> bodies = List.of("My reading is 04821.", "Why is my bill £42.50?",
        "Call 07700 900123 or 01632 960456.", "Card 4111-1111-1111-1111 was charged twice",
        "thanks for nothing", "Best time is 09:30", "Meter fixed now", "Hi meter broken",
        "Account TVW-12345678 please", "Thanks for the refund.", "tom@example.com is my email");
    List<String> closings = List.of("Thanks,\nPriya", "Many thanks\nTom", "Kind regards,\nSam\nTVWW Customer Care",
        "-- \nTom Fairley\n+44 20 7946 0000", "Sent from my phone", "Cheers", "If you have any other questions, call us.",
        "On Tue, 3 Mar 2026, Care wrote:\n> Hello", "");
    Random random = new Random(20260312L);
    for (int n = 0; n < 2000; n++) {
      StringBuilder mail = new StringBuilder(pick(random, openings)).append('\n');
      for (int k = random.nextInt(4); k >= 0; k--) {
        mail.append(pick(random, bodies)).append(random.nextBoolean() ? "\n" : " ");
      }
      mail.append(pick(random, closings));
      String raw = mail.toString();
      String once = cleaner.cleanQuestion(raw);
      assertEquals(once, cleaner.cleanQuestion(once), raw);
      String reply = cleaner.cleanReply(raw);
      assertEquals(reply, cleaner.cleanReply(reply), raw);
    }
  }

  private static String pick(Random random, List<String> options) {
    return options.get(random.nextInt(options.size()));
  }
}
