package org.precedent.knowledge.clean;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * Realistic mails (invented for the demo utility, TVWW) reduced to their substance. The layouts
 * follow common mail-client practice; the "-- " signature separator is RFC 3676 section 4.3.
 */
class StrippingTest {
  private final TextCleaner cleaner = TextCleaner.standard();

  @Test
  void stripsGreetingAndNamedSignOff() {
    String mail = "Hi Dana,\n\nMy water bill went up from £42.50 to £61.00 this month. Why?\n\n"
        + "Thanks,\nPriya";
    assertEquals("My water bill went up from £42.50 to £61.00 this month. Why?",
        cleaner.cleanQuestion(mail));
  }

  @Test
  void stripsGreetingWithoutPunctuationAndTwoLineSignOff() {
    String mail = "Hello there\nI'd like to move my direct debit to the 15th.\nMany thanks\nTom";
    assertEquals("I'd like to move my direct debit to the 15th.", cleaner.cleanQuestion(mail));
  }

  @Test
  void stripsFormalLetterOpeningAndClosing() {
    String mail = "Dear Sir/Madam,\n\nI am writing about the estimated reading on my last bill.\n"
        + "The meter actually reads 04821.\n\nYours faithfully,\nTom Fairley";
    assertEquals("I am writing about the estimated reading on my last bill.\n"
        + "The meter actually reads 04821.", cleaner.cleanQuestion(mail));
  }

  @Test
  void stripsSeveralOpeningsAndAGreetingInFrontOfTheFirstSentence() {
    assertEquals("the pressure is low again.", cleaner.cleanQuestion(
        "Hiya team\nGood morning!\nHope you're well.\nHi Dana, the pressure is low again.\nCheers"));
  }

  @Test
  void stripsPleasantryInFrontOfTheFirstSentence() {
    assertEquals("My bill is wrong.",
        cleaner.cleanQuestion("Hi team, hope you're well. My bill is wrong."));
  }

  @Test
  void stripsSignatureAfterTheSeparator() {
    String mail = "Hi,\nThere is a leak outside 14 Mill Lane.\n-- \nTom Fairley\n07700 900123\n"
        + "Flat 2, 14 Mill Lane";
    assertEquals("There is a leak outside 14 Mill Lane.", cleaner.cleanQuestion(mail));
  }

  @Test
  void stripsQuotedReplyAfterOnWroteLine() {
    String mail = "Yes, the reading was 04821.\n\n"
        + "On Tue, 3 Mar 2026, TVWW Customer Care <care@example.com> wrote:\n"
        + "> Could you send us a meter reading?\n> Kind regards\n> Sam";
    assertEquals("Yes, the reading was 04821.", cleaner.cleanQuestion(mail));
  }

  @Test
  void stripsOnWroteLineWrappedOverTwoLines() {
    String mail = "Still no water.\n\nOn Tue, 3 Mar 2026 at 10:02, TVWW Customer Care\n"
        + "<care@example.com> wrote:\nWe are sorry to hear ...";
    assertEquals("Still no water.", cleaner.cleanQuestion(mail));
  }

  @Test
  void stripsOriginalMessageBlock() {
    String mail = "Please cancel the visit.\nRegards\nTom Fairley\n\n-----Original Message-----\n"
        + "From: TVWW Customer Care\nSent: 03 March 2026 10:02\nSubject: Your visit";
    assertEquals("Please cancel the visit.", cleaner.cleanQuestion(mail));
  }

  @Test
  void stripsFromSentHeaderBlock() {
    String mail = "Please cancel the visit.\n________________________________\n"
        + "From: Care <care@example.com>\nSent: Tuesday, 3 March 2026 10:02\nTo: Tom\n"
        + "Subject: Your visit\n\nYour engineer will call on Friday.";
    assertEquals("Please cancel the visit.", cleaner.cleanQuestion(mail));
  }

  @Test
  void stripsMobileFooter() {
    assertEquals("Is there a hosepipe ban this week?", cleaner.cleanQuestion(
        "Is there a hosepipe ban this week?\n\nSent from my iPhone"));
    assertEquals("Is there a hosepipe ban this week?", cleaner.cleanQuestion(
        "Is there a hosepipe ban this week?\nSent from my phone"));
  }

  @Test
  void keepsThanksInTheMiddleOfAOneLineQuestion() {
    String q = "My bill says thanks for paying but I have not paid yet?";
    assertEquals(q, cleaner.cleanQuestion(q));
    String p = "Can you check my bill, thanks";
    assertEquals(p, cleaner.cleanQuestion(p));
  }

  @Test
  void stripsThanksAtTheEndOfTheLastSentence() {
    assertEquals("Why has my bill doubled?",
        cleaner.cleanQuestion("Why has my bill doubled? Thanks, Priya"));
  }

  @Test
  void keepsContentBetweenTwoThanks() {
    String mail = "Thanks for the quick reply.\nThe meter is still broken.\nThanks,\nTom";
    assertEquals("Thanks for the quick reply.\nThe meter is still broken.",
        cleaner.cleanQuestion(mail));
  }

  @Test
  void keepsSentencesThatOnlyLookLikeGreetings() {
    assertEquals("Hi meter broken\nPlease send someone.",
        cleaner.cleanQuestion("Hi meter broken\nPlease send someone."));
    assertEquals("Best time to call is after 5pm.\nThe leak is getting worse.",
        cleaner.cleanQuestion("Best time to call is after 5pm.\nThe leak is getting worse."));
  }

  @Test
  void keepsTheRedactedOriginalWhenOnlyGreetingsAreLeft() {
    assertEquals("Hi,\n\nThanks!\nTom", cleaner.cleanQuestion("Hi,\n\n\nThanks!\nTom"));
    assertEquals("> only quoted text from [EMAIL]",
        cleaner.cleanQuestion("> only quoted text from tom@example.com"));
  }

  @Test
  void stripsAgentOpeningClosingAndSignOffBlock() {
    String reply = "Hi Priya,\n\nThank you for contacting us.\n\n"
        + "Your bill rose because the estimated reading was replaced by your actual reading.\n\n"
        + "If you have any other questions, please don't hesitate to get in touch.\n\n"
        + "Kind regards,\nSam\nTVWW Customer Care";
    assertEquals("Your bill rose because the estimated reading was replaced by your actual reading.",
        cleaner.cleanReply(reply));
  }

  @Test
  void stripsAgentFooterWithRedactedContactLines() {
    String reply = "Dear Mr Fairley,\n\nWe have booked an engineer for Friday between 08:00 and 12:00.\n"
        + "I hope this helps.\n\nBest wishes\nSam Okafor\nCustomer Care Advisor\nTVWW\n"
        + "Tel: 01632 960 456\ncare@example.com";
    assertEquals("We have booked an engineer for Friday between 08:00 and 12:00.",
        cleaner.cleanReply(reply));
  }

  @Test
  void stripsAgentSignOffWithCompanyFooter() {
    String reply = "Hi Tom,\n\nThanks for getting in touch.\n\nI've cancelled the visit on Friday.\n\n"
        + "Have a great day!\n\nKind regards,\nSam\nCustomer Care Advisor\n"
        + "TVWW | Thames Valley Water & Waste\nwww.example.com";
    assertEquals("I've cancelled the visit on Friday.", cleaner.cleanReply(reply));
  }

  @Test
  void stripsAgentSignOffAtTheEndOfTheLastSentence() {
    assertEquals("your direct debit date is now the 15th.", cleaner.cleanReply(
        "Hello Tom, your direct debit date is now the 15th. Best wishes, Sam"));
  }

  @Test
  void normalisesWhitespace() {
    assertEquals("Low pressure at\tnight.".replace('\t', ' ') + "\n\nSince Monday.",
        cleaner.cleanQuestion("  Low   pressure at\tnight.  \r\n\r\n\r\n  Since  Monday. \u200B"));
  }
}
