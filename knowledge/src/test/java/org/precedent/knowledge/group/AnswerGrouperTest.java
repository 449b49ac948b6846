package org.precedent.knowledge.group;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.precedent.knowledge.ticket.Ticket;

class AnswerGrouperTest {
  private static final String MISSED_BIN = "We are sorry your bin was missed. A crew will return "
      + "within two working days to empty it. Please leave the bin out at the kerb until then. "
      + "You can check your collection day at any time on our website.";
  private static final String METER = "You can submit a meter reading online or by phone. Read the "
      + "black digits from left to right and ignore the red ones. We will send a revised bill "
      + "within five working days if the reading changes what you owe.";

  private static Ticket ticket(String id, String reply) {
    return new Ticket(id, "question " + id, reply, null, null, null);
  }

  @Test
  void editedRepliesOfOneAnswerFormOneGroup() {
    List<Ticket> tickets = new ArrayList<>();
    tickets.add(ticket("a1", MISSED_BIN));
    tickets.add(ticket("a2", MISSED_BIN));
    // a sentence dropped
    tickets.add(ticket("a3", MISSED_BIN.replace(" Please leave the bin out at the kerb until then.", "")));
    // a word changed and a courtesy sentence added
    tickets.add(ticket("a4", "Sorry for the trouble. " + MISSED_BIN.replace("two", "three")));
    tickets.add(ticket("m1", METER));
    tickets.add(ticket("m2", METER.replace("five", "ten")));
    tickets.add(ticket("m3", METER + " Thanks for letting us know."));
    tickets.add(ticket("x1", "Your complaint about the roadworks on Mill Lane has gone to our "
        + "engineering manager, who will call you this week."));

    Grouping grouping = AnswerGrouper.standard().group(tickets);

    assertEquals(2, grouping.groups().size(), grouping.toString());
    assertEquals(List.of("a1", "a2", "a3", "a4"), grouping.groups().get(0).ticketIds());
    assertEquals(MISSED_BIN, grouping.groups().get(0).canonical(), "the most frequent text");
    assertEquals(List.of("m1", "m2", "m3"), grouping.groups().get(1).ticketIds());
    assertEquals(List.of("x1"), grouping.oneOffs());
  }

  @Test
  void differentAnswersStayApartEvenWhenTheyShareCourtesyPhrases() {
    List<Ticket> tickets = new ArrayList<>();
    for (int i = 0; i < 3; i++) {
      tickets.add(ticket("a" + i, "Thank you for getting in touch. " + MISSED_BIN));
      tickets.add(ticket("m" + i, "Thank you for getting in touch. " + METER));
    }
    Grouping grouping = AnswerGrouper.standard().group(tickets);
    assertEquals(2, grouping.groups().size());
  }

  @Test
  void aLabelColumnDefinesTheGroups() {
    List<Ticket> tickets = List.of(
        new Ticket("1", "how do I change my pin", "pin change", "pin_change", null, null),
        new Ticket("2", "new pin please", "pin change", "pin_change", null, null),
        new Ticket("3", "card stolen", "report lost card", "lost_card", null, null),
        new Ticket("4", "what is the meaning of life", "no label here", null, null, null));
    Grouping grouping = AnswerGrouper.standard().group(tickets);
    assertEquals(List.of("pin_change", "lost_card"),
        grouping.groups().stream().map(AnswerGroup::id).toList());
    assertEquals(List.of("4"), grouping.oneOffs());
    assertTrue(grouping.method().contains("label"));
  }

  @Test
  void aReplyIsMatchedToTheGroupWhoseAnswerItReuses() {
    List<Ticket> tickets = List.of(ticket("a1", MISSED_BIN), ticket("a2", MISSED_BIN),
        ticket("a3", MISSED_BIN), ticket("m1", METER), ticket("m2", METER), ticket("m3", METER));
    AnswerGrouper grouper = AnswerGrouper.standard();
    Grouping grouping = grouper.group(tickets);
    assertEquals(List.of("m1", "m2", "m3"),
        grouper.match(grouping, METER.replace("online or ", "")).orElseThrow().ticketIds());
    assertTrue(grouper.match(grouping, "Please call the emergency line now.").isEmpty());
  }
}
