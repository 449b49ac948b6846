package org.precedent.engine.safety;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The customer-facing cautions. */
class CautionsTest {

  private static final List<String> TOPICS = List.of("water-quality", "sewage", "burst-main", "gas", "electricity",
      "health", "legal", "money-dispute", "distress", "emergency", "account-security", "lost-stolen", "fraud",
      "vulnerable-supply");

  private static List<String> allCautions() {
    List<String> all = new ArrayList<>();
    TOPICS.forEach(t -> all.add(Cautions.forTopic(t)));
    TOPICS.forEach(t -> all.add(Cautions.forTopic(t, "our emergency line on 01632 960999")));
    all.add(Cautions.general());
    SafetyPolicy.defaults().rules().forEach(r -> all.add(r.caution()));
    return all;
  }

  @Test
  void everyCautionEndsSayingAPersonWillFollowUpAndOfficialInstructionsComeFirst() {
    assertTrue(Cautions.CLOSING.contains("will follow up"));
    assertTrue(Cautions.CLOSING.contains("public-health notices"));
    assertTrue(Cautions.CLOSING.contains("emergency services always come first"));
    for (String caution : allCautions()) {
      assertTrue(caution.endsWith(Cautions.CLOSING), caution);
    }
  }

  @Test
  void everyTopicHasItsOwnTextBeforeTheClosing() {
    for (String topic : TOPICS) {
      assertTrue(Cautions.hasBuiltIn(topic), topic);
      assertFalse(Cautions.forTopic(topic).equals(Cautions.general()), topic);
    }
  }

  @Test
  void builtInCautionsNameNoPhoneNumberOfTheirOwn() {
    // Numbers differ by country and utility, so only a policy file may name one.
    for (String topic : TOPICS) {
      assertFalse(Cautions.forTopic(topic).matches(".*\\d.*"), topic);
    }
    assertFalse(Cautions.general().matches(".*\\d.*"));
  }

  @Test
  void theEmergencyLineIsFilledInWhereTheTopicNeedsIt() {
    for (String topic : List.of("water-quality", "sewage", "burst-main")) {
      assertTrue(Cautions.forTopic(topic).contains("call our emergency line"), topic);
      assertTrue(Cautions.forTopic(topic, "our emergency line on 01632 960999").contains("01632 960999"), topic);
    }
    allCautions().forEach(c -> assertFalse(c.contains(Cautions.EMERGENCY_LINE_SLOT), c));
  }

  @Test
  void cautionsSayWhatToDo() {
    assertTrue(Cautions.forTopic("water-quality").contains("don't drink"));
    assertTrue(Cautions.forTopic("water-quality").contains("cold kitchen tap"));
    assertTrue(Cautions.forTopic("sewage").contains("children and pets"));
    assertTrue(Cautions.forTopic("sewage").contains("wash your hands"));
    assertTrue(Cautions.forTopic("burst-main").contains("don't drive"));
    assertTrue(Cautions.forTopic("gas").contains("gas emergency number"));
    assertTrue(Cautions.forTopic("electricity").contains("network operator"));
    assertTrue(Cautions.forTopic("health").contains("medical advice"));
    assertTrue(Cautions.forTopic("legal").contains("a person will review"));
    assertTrue(Cautions.forTopic("money-dispute").contains("a person will review"));
    assertTrue(Cautions.forTopic("money-dispute").contains("disputed charge, refund or debt"));
    assertTrue(Cautions.forTopic("legal").contains("regulator or ombudsman"));
    assertTrue(Cautions.forTopic("distress").contains("call your local emergency number now"));
    assertTrue(Cautions.forTopic("emergency").contains("call your local emergency number now"));
    assertTrue(Cautions.forTopic("account-security").contains("one-time codes"));
    assertTrue(Cautions.forTopic("lost-stolen").contains("stop it being used"));
    assertTrue(Cautions.forTopic("fraud").contains("a number you already trust"));
    assertTrue(Cautions.forTopic("vulnerable-supply").contains("medical equipment"));
  }

  @Test
  void combiningCautionsKeepsEachTextOnceInOrderAndTheClosingOnceAtTheEnd() {
    String gas = Cautions.forTopic("gas");
    String sewage = Cautions.forTopic("sewage");
    String combined = Cautions.combine(List.of(gas, sewage, gas));
    String gasBody = gas.substring(0, gas.length() - Cautions.CLOSING.length()).strip();
    String sewageBody = sewage.substring(0, sewage.length() - Cautions.CLOSING.length()).strip();
    assertEquals(gasBody + " " + sewageBody + " " + Cautions.CLOSING, combined);
    assertEquals(gas, Cautions.combine(List.of(gas)));
    assertThrows(IllegalArgumentException.class, () -> Cautions.combine(List.of()));
  }

  @Test
  void anUnknownTopicGetsTheGeneralCaution() {
    assertEquals(Cautions.general(), Cautions.forTopic("asbestos"));
  }

  @Test
  void composeAddsTheClosingOnceAndRefusesBlankText() {
    String once = Cautions.compose("Keep away.", "our emergency line");
    assertEquals(once, Cautions.compose(once, "our emergency line"));
    assertThrows(IllegalArgumentException.class, () -> Cautions.compose("  ", "our emergency line"));
    assertThrows(IllegalArgumentException.class, () -> Cautions.compose("Keep away.", " "));
  }
}
