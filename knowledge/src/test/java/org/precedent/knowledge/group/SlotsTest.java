package org.precedent.knowledge.group;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/** Replies of an invented council's help desk whose differing places are known. */
class SlotsTest {

  @Test
  void daysDifferAndBecomeOneSlot() {
    List<String> replies = List.of(
        "Your bin collection day is Tuesday. Please put the bin out by 7am.",
        "Your bin collection day is Friday. Please put the bin out by 7am.",
        "Your bin collection day is Monday. Please put the bin out by 7am.",
        "Your bin collection day is Tuesday. Please put the bin out by 7am.",
        "Your bin collection day is Thursday. Please put the bin out by 7am.");
    assertEquals(Optional.of("Your bin collection day is ⟦slot:day⟧. Please put the bin out by 7am."),
        Slots.of(replies.get(0), replies));
  }

  @Test
  void amountAndReferenceAreTwoSlots() {
    List<String> replies = List.of(
        "We have refunded £12.50 to your card under reference RF-20931, allow five working days.",
        "We have refunded £40.00 to your card under reference RF-11872, allow five working days.",
        "We have refunded £7.25 to your card under reference RF-55310, allow five working days.");
    String template = Slots.of(replies.get(0), replies).orElseThrow();
    assertEquals("We have refunded ⟦slot:amount⟧ to your card under reference ⟦slot:number⟧,"
        + " allow five working days.", template);
    assertEquals(List.of("amount", "number"), Slots.names(template));
  }

  @Test
  void oneReplyOrIdenticalRepliesHaveNoSlots() {
    String r = "Reset your password from the sign-in page.";
    assertTrue(Slots.of(r, List.of(r)).isEmpty());
    assertTrue(Slots.of(r, List.of(r, r, r)).isEmpty());
  }

  @Test
  void veryDifferentRepliesKeepTheCanonicalReply() {
    List<String> replies = List.of(
        "Your parking permit renews every year in March online.",
        "Call the parking office to change the vehicle on your permit.",
        "Visitor permits are sold in books of ten at the library.");
    assertTrue(Slots.of(replies.get(0), replies).isEmpty());
  }
}
