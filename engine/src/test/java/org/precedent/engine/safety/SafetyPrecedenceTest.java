package org.precedent.engine.safety;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Questions that several rules match: the rule naming the situation comes before rules naming only a sign of it,
 * equals keep the policy's order (most urgent risk first), every match is reported, and the caution holds every
 * matched topic's advice, the first match's first.
 */
class SafetyPrecedenceTest {

  private static final SafetyPolicy DEFAULTS = SafetyPolicy.defaults();

  private static SafetyFinding check(String question) {
    return DEFAULTS.check(question, null, null).orElseThrow(() -> new AssertionError("no rule on: " + question));
  }

  /**
   * Each row: the question, the rule that must come first, and every rule the finding must list, in order. Why
   * each winner wins is in the last column, for the reader; the test checks the first three.
   */
  @ParameterizedTest(name = "{1}: {0}")
  @CsvSource(delimiter = '|', textBlock = """
      Sewage coming up through the drain in my garden and it smells awful | sewage-flooding | sewage-flooding wq-off-taste | sewage is the situation; the smell is its sign
      The water went brown after the burst main on Mill Lane | burst-main | burst-main wq-discoloured | the burst explains the colour
      Since the burst main on Weir Street our tap water smells of chemicals | burst-main | burst-main wq-smell-taste wq-off-taste | the burst explains the smell
      I can smell gas and the water tastes strange | gas | gas wq-off-taste | a gas smell names the danger; a strange taste is a sign
      The water is contaminated and smells of petrol | wq-contaminated | wq-contaminated wq-smell-taste wq-off-taste | contamination named outranks the smell it gives
      Brown water from the taps and the kids have had diarrhoea since | health-after-drinking | health-after-drinking wq-discoloured | people ill is the situation; the colour a sign
      We were sick after drinking water from the tap, it tastes of bleach | health-after-drinking | health-after-drinking wq-smell-taste | people ill is the situation; the taste a sign
      Sewage flooded the cellar and the sockets are under water | electricity | electricity sewage-flooding | two situations: live sockets are the more urgent
      Water gushing into the road and the kids are feeling sick after drinking it | health-after-drinking | health-after-drinking burst-water-in-road | two situations: people ill before the flood
      Smoke is coming from the fuse box and there's a burning smell | emergency-danger | emergency-danger emergency-burning-smell | smoke is the situation; the smell its sign
      My card was stolen and there are charges on it I don't recognise | lost-stolen-payment | lost-stolen-payment fraud-signs | the theft explains the charges
      Someone hacked my account and there are transactions I don't recognise | account-compromise | account-compromise fraud-signs | the break-in explains the transactions
      There's a suspicious charge on my card and I want to dispute it | disputed-charge | disputed-charge fraud-signs | a dispute named outranks a suspicion
      I'll kill myself if the bailiffs come back | distress-self-harm | distress-self-harm money-dispute | two situations: a life before a debt
      I feel like ending it all, someone emptied my account | distress-self-harm | distress-self-harm fraud | two situations: a life before money
      My wallet was stolen and now someone has hacked my online banking | account-compromise | account-compromise lost-stolen-payment | two situations: access now before a card that may be used
      My solicitor says the county court judgment was your mistake | money-dispute | money-dispute legal | two situations: the debt first, so a judgment reads as a debt matter
      Sewage in my kitchen and I'm going to sue you | sewage-flooding | sewage-flooding legal | two situations: health before a legal threat
      I've been charged twice and I'm reporting you to the ombudsman | disputed-charge | disputed-charge legal | two situations: the money before the complaint
      The power cut has stopped my dad's oxygen machine and I can smell burning | energy-medical-dependency | energy-medical-dependency emergency-burning-smell | a life on equipment is the situation; a smell a sign
      """)
  void theMostSpecificRuleComesFirstAndEveryMatchIsListed(String question, String winner, String all, String why) {
    SafetyFinding f = check(question);
    assertEquals(winner, f.ruleId(), () -> "expected " + winner + " (" + why + "), matches: " + ids(f));
    assertEquals(Arrays.asList(all.split(" ")), ids(f), () -> "matches on: " + question);
    assertEquals(f.matches().get(0).topic(), f.topic());
    assertEquals(f.matches().get(0).matched(), f.matched());
  }

  @Test
  void theSewageQuestionGetsTheSewageCautionFirstAndTheWaterCautionAfterIt() {
    SafetyFinding f = check("Sewage coming up through the drain in my garden and it smells awful");
    assertEquals("sewage", f.topic());
    assertEquals(List.of("sewage", "water-quality"), f.topics());
    String sewage = body(Cautions.forTopic("sewage"));
    String water = body(Cautions.forTopic("water-quality"));
    assertTrue(f.caution().startsWith(sewage), f.caution());
    assertTrue(f.caution().indexOf(water) > sewage.length() - 1, f.caution());
    assertTrue(f.caution().endsWith(Cautions.CLOSING), f.caution());
    assertEquals(f.caution().indexOf(Cautions.CLOSING), f.caution().lastIndexOf(Cautions.CLOSING),
        "the closing sentence once");
  }

  @Test
  void aTopicMatchedByTwoRulesGivesItsCautionOnce() {
    SafetyFinding f = check("The water is contaminated and smells of petrol");
    assertEquals(3, f.matches().size());
    assertEquals(Cautions.forTopic("water-quality"), f.caution());
  }

  @Test
  void eachMatchKeepsItsOwnCautionAndText() {
    SafetyFinding f = check("I'll kill myself if the bailiffs come back");
    SafetyFinding.Match second = f.matches().get(1);
    assertEquals("money-dispute", second.topic());
    assertEquals("bailiffs", second.matched());
    assertEquals(Cautions.forTopic("money-dispute"), second.caution());
    assertEquals(SafetyRule.Specificity.SITUATION, second.specificity());
  }

  @Test
  void everySituationComesBeforeEverySign() {
    SafetyFinding f = check("Black bits in the water, it smells off, and sewage is coming up in the yard");
    List<SafetyRule.Specificity> levels = f.matches().stream().map(SafetyFinding.Match::specificity).toList();
    assertEquals(SafetyRule.Specificity.SITUATION, levels.get(0));
    assertEquals(levels.stream().sorted().toList(), levels);
    assertTrue(levels.contains(SafetyRule.Specificity.SIGN));
  }

  @Test
  void aFileRuleDeclaredASignComesAfterABuiltInSituationAndAFileSituationBeforeABuiltInSign() throws IOException {
    SafetyPolicy policy = PolicyFile.parse(List.of(
        "rule odd-pong sign | water-quality | a (?:funny|odd) pong",
        "rule river-foam | sewage | foam on the (?:river|brook)"), "test.rules");
    SafetyFinding sign = policy.check("There's sewage coming up in the garden and a funny pong", null, null)
        .orElseThrow();
    assertEquals(List.of("sewage-flooding", "odd-pong"), ids(sign));
    SafetyFinding situation = policy.check("The tap water smells awful and there's foam on the river", null, null)
        .orElseThrow();
    assertEquals("river-foam", situation.ruleId());
    assertEquals(SafetyRule.Specificity.SITUATION, situation.matches().get(0).specificity());
  }

  @Test
  void aSingleMatchIsReportedAsBefore() {
    SafetyFinding f = check("I can smell gas near the meter");
    assertEquals(List.of("gas"), ids(f));
    assertEquals(Cautions.forTopic("gas"), f.caution());
  }

  private static List<String> ids(SafetyFinding f) {
    return f.matches().stream().map(SafetyFinding.Match::ruleId).toList();
  }

  private static String body(String caution) {
    return caution.substring(0, caution.length() - Cautions.CLOSING.length()).strip();
  }
}
