package org.precedent.knowledge.clean;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.concurrent.atomic.AtomicReference;
import java.util.function.Supplier;
import org.junit.jupiter.api.Test;

/**
 * Texts built to hurt the cleaner: 100 KB of one short unit repeated, each unit something a rule
 * looks for (digits for the card and phone rules, '@' for e-mail, greetings, sign-offs, quote
 * headers). Each must be cleaned on a small stack.
 */
class HostileTextTest {
  private static final String[] UNITS = {"a'", "a\u2019", "a' ", "1 ", "1-", "1", "+1 ", "0", "0 ",
      "a@", "a.", "a.a@", "-", "-- ", "on ", "from: x ", "Dana ", "thanks ", ". Thanks", "[A", "[",
      "TVW", "GB82 ", "GB82WEST", "ab12 ", "x ", "\n", "a\n", "hi\n", "thanks\n", "Sam\n", "(0",
      "(01234) ", "07700 ", "1.", "1. ", "Hi Dana, ", "Hope you're well. ", "sent from my ",
      "> ", "On Tue wrote:\n", "Regards,\n", "4111 "};
  private final TextCleaner cleaner = TextCleaner.standard();

  private static String hostile(String unit) {
    StringBuilder b = new StringBuilder("My bin was not emptied. ");
    while (b.length() < 100_000) {
      b.append(unit);
    }
    return b.toString();
  }

  @Test
  void aHundredKilobyteTextIsCleanedOnASmallStack() throws InterruptedException {
    for (String unit : UNITS) {
      String text = hostile(unit);
      onSmallStack(() -> cleaner.cleanQuestion(text), unit);
      onSmallStack(() -> cleaner.cleanReply(text), unit);
    }
  }

  /**
   * Thousands of stacked sign-offs are not taken one pass at a time (each pass reads the line
   * again: quadratic); the cleaner takes a bounded number and leaves the rest.
   */
  @Test
  void stackedSignOffsAreTakenABoundedNumberAtATime() {
    String text = "My bin was not emptied." + " Thanks.".repeat(5000);
    String once = cleaner.cleanQuestion(text);
    int left = count(once, "Thanks.");
    assertTrue(once.startsWith("My bin was not emptied."),
        () -> once.substring(0, Math.min(40, once.length())));
    assertTrue(left >= 5000 - 3 * MailStripper.MAX_REMOVALS && left < 5000,
        left + " sign-offs left of 5000");
    // A real mail's closings are all taken in one cleaning.
    assertEquals("My bin was not emptied.",
        cleaner.cleanQuestion("My bin was not emptied. Thanks. Thanks again.\nKind regards,\nSam"));
  }

  private static int count(String text, String part) {
    int n = 0;
    for (int i = text.indexOf(part); i >= 0; i = text.indexOf(part, i + 1)) {
      n++;
    }
    return n;
  }

  private static void onSmallStack(Supplier<?> work, String unit) throws InterruptedException {
    AtomicReference<Throwable> failure = new AtomicReference<>();
    Thread t = new Thread(null, () -> {
      try {
        work.get();
      } catch (Throwable e) {
        failure.set(e);
      }
    }, "small-stack", 256 * 1024);
    t.start();
    t.join();
    if (failure.get() != null) {
      throw new AssertionError("'" + unit + "' repeated: failed on a 256 KB stack: " + failure.get());
    }
  }
}
