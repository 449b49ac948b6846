package org.precedent.engine.safety;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.HashSet;
import java.util.Optional;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

/** The built-in rules on invented customer wording: what must reach a person, and what must not be held back. */
class DefaultRulesTest {

  private static final SafetyPolicy DEFAULTS = SafetyPolicy.defaults();

  private static Optional<SafetyFinding> check(String question) {
    return DEFAULTS.check(question, null, null);
  }

  @ParameterizedTest(name = "{1}: {0}")
  @CsvSource(delimiter = '|', textBlock = """
      The water from my kitchen tap is brown                                  | water-quality
      The water coming out of my kitchen tap is brown. Is it safe to drink?   | water-quality
      brown water coming out of the bath taps, what do I do                   | water-quality
      Why is my water discolored?                                              | water-quality
      The water has gone a really dark orange since this morning               | water-quality
      There are black bits floating in the glass when I fill it                | water-quality
      Our tap water smells of bleach and the kettle tastes of chemicals        | water-quality
      the water stinks of drains when I run the hot tap                        | water-quality
      I'm worried our water is contaminated after the works outside            | water-quality
      there's sewage coming up through the drain in my garden                  | sewage
      Sewage in the kitchen after last night's storm                           | sewage
      Our cellar is flooded with sewage                                        | sewage
      a burst main on Mill Lane is flooding the road                           | burst-main
      Water gushing out of the pavement by the bus stop                        | burst-main
      The road has collapsed where the water is coming up                      | burst-main
      I can smell gas near the meter                                           | gas
      Our carbon monoxide alarm went off while the plumber was here            | gas
      My daughter got an electric shock from the shower                        | electricity
      The socket by the sink is sparking since the leak                        | electricity
      my son was sick after drinking tap water                                 | health
      We have all had diarrhoea since the water changed colour                 | health
      The baby has been vomiting and we've been using the tap water for bottles | health
      I have instructed my solicitor                                           | legal
      If this isn't resolved I will take you to court                          | legal
      I'm taking this to the ombudsman                                         | legal
      A bailiff came to my door about the water bill                           | money-dispute
      I now have a county court judgment because of your mistake               | money-dispute
      I want compensation for the carpets                                      | money-dispute
      """)
  void fires(String question, String topic) {
    Optional<SafetyFinding> finding = check(question);
    assertTrue(finding.isPresent(), () -> "no rule fired on: " + question);
    assertEquals(topic, finding.get().topic(), () -> "rule " + finding.get().ruleId() + " on: " + question);
    assertEquals(SafetyFinding.Kind.TERM, finding.get().kind());
  }

  @ParameterizedTest
  @ValueSource(strings = {
      "how do I read my water meter",
      "my bill is brown envelope?",
      "when is the brown bin collected",
      "The brown bin wasn't emptied on Tuesday",
      "Can I get a new brown caddy for food waste?",
      "I've been flooded with emails since I went paperless",
      "There's a leak in my toilet cistern, will you fix it?",
      "What is the sewerage charge on my bill for?",
      "Who clears a blocked drain shared with next door?",
      "There's water coming up in my front garden. Is that my pipe or yours?",
      "I'm sick of getting estimated bills",
      "I got a shock when I opened my bill",
      "Our water is cloudy but clears from the bottom up",
      "The water tastes a bit like a swimming pool at the moment",
      "Can I put small electricals in the recycling?",
      "I live at 4 Kestrel Court, please update my address",
      "Can I pay in court fees",
      "My husband is ill and can't move the bins to the kerb",
      "Sue Smith is the new account holder",
      "The final reminder says my debt may go to a collection agency"})
  void doesNotFireOnRoutineQuestions(String question) {
    Optional<SafetyFinding> finding = check(question);
    assertTrue(finding.isEmpty(), () -> "rule " + finding.get().ruleId() + " fired on '" + finding.get().matched()
        + "' in: " + question);
  }

  @Test
  void courtAloneIsNotLegalBecauseItIsAlsoAStreetName() {
    // A deliberate choice: "court fees" or "Kestrel Court" pass, "take you to court" and "small claims" do not.
    assertTrue(check("Is the court fee refundable if I pay in full?").isEmpty());
    assertEquals("legal", check("I'll see you in small claims").orElseThrow().topic());
  }

  @Test
  void brownWaterFiresWhereTheBrownBinDoesNot() {
    assertEquals("wq-discoloured", check("brown water from the tap again").orElseThrow().ruleId());
    assertTrue(check("brown bin and brown caddy both missed").isEmpty());
  }

  @Test
  void bothSpellingsOfDiscolouredFire() {
    assertTrue(check("discoloured water").isPresent());
    assertTrue(check("discolored water").isPresent());
  }

  @Test
  void matchesAcrossLineBreaksCaseAndCurlyApostrophes() {
    SafetyFinding f = check("There\u2019s SEWAGE\n\n   coming UP in our garden").orElseThrow();
    assertEquals("sewage-flooding", f.ruleId());
    assertEquals("SEWAGE coming", f.matched());
  }

  @Test
  void matchesWholeWordsOnly() {
    // "gas leaks" fires, but a word that merely contains the term does not.
    assertTrue(check("possible gas leaks in the street").isPresent());
    assertTrue(check("the Vegas leak test kit").isEmpty());
  }

  @Test
  void reportsTheMatchedText() {
    assertEquals("smell gas", check("I can smell gas near the meter").orElseThrow().matched());
  }

  @Test
  void everyDefaultTopicHasARuleAndIdsAreUnique() {
    Set<String> topics = new HashSet<>();
    Set<String> ids = new HashSet<>();
    for (SafetyRule r : DEFAULTS.rules()) {
      topics.add(r.topic());
      assertTrue(ids.add(r.id()), () -> "duplicate id " + r.id());
    }
    assertEquals(Set.of("water-quality", "sewage", "burst-main", "gas", "electricity", "health", "legal",
        "money-dispute", "distress", "emergency", "account-security", "lost-stolen", "fraud", "vulnerable-supply"),
        topics);
    topics.forEach(t -> assertTrue(Cautions.hasBuiltIn(t), () -> "no built-in caution for " + t));
  }
}
