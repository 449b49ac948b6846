package org.precedent.engine.safety;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * The general part of the built-in rules, which every help desk gets, and the energy pack, on invented wording from
 * several trades (a bank, a shop, an energy supplier, a water utility): what must reach a person, and what must not
 * be held back.
 */
class GeneralRulesTest {

  /** The general part alone, as {@code trade-packs = none} gives it. */
  private static final SafetyPolicy GENERAL = parse("trade-packs = none");

  private static SafetyPolicy parse(String... lines) {
    try {
      return PolicyFile.parse(List.of(lines), "test.rules");
    } catch (IOException e) {
      throw new AssertionError(e);
    }
  }

  private static Optional<SafetyFinding> check(SafetyPolicy policy, String question) {
    return policy.check(question, null, null);
  }

  @ParameterizedTest(name = "{1}: {0}")
  @CsvSource(delimiter = '|', textBlock = """
      I want to kill myself, I can't deal with these debts                      | distress
      Honestly I don't want to live anymore                                     | distress
      I have been self-harming again since the bailiffs came                    | distress-or-money
      Everyone would be better off without me                                   | distress
      I've taken an overdose                                                    | distress
      There's smoke pouring out of the meter cupboard                           | emergency
      My dad has collapsed and isn't breathing properly                         | emergency
      my neighbour fell into the open trench and broke his leg                  | emergency
      My ex has threatened to kill me if I don't give him the account details   | emergency
      I'm scared for my safety, he keeps turning up at the door                 | emergency
      There's a burning smell coming from the plug                              | emergency
      Someone hacked into my online banking last night                          | account-security
      I think my account has been compromised                                    | account-security
      Please freeze my account immediately                                      | account-security
      Can you put a block on my debit card right now                            | account-security
      I gave my PIN to a man who said he was from the bank                      | account-security
      I've lost my purse with both my cards in it                               | lost-stolen
      My wallet was stolen on the train this morning                            | lost-stolen
      I was mugged and they took my bank card                                   | lost-stolen
      There's a payment on my statement that I didn't make                      | fraud
      I think I've been scammed by a fake delivery text                         | fraud
      Someone has used my card details to buy things online                     | fraud
      Money has disappeared from my current account overnight                   | fraud
      There are three transactions I don't recognise on my statement            | fraud
      I didn't authorise this purchase                                          | fraud
      There's a charge on my statement I know nothing about                     | fraud
      I keep getting sent things I never ordered and paying for them            | fraud
      Please lock my card, I think someone has the number                       | account-security
      How do I stop anyone from using my account                                | account-security
      Can you turn off my debit card until I find it                            | account-security
      I left my credit card in a taxi last night                                | lost-stolen
      My bank card has disappeared from my bag                                  | lost-stolen
      I want to dispute this charge, I never received the goods                 | money-dispute
      You've charged me twice for the same order                                | money-dispute
      The shop refused to give me a refund for a faulty kettle                  | money-dispute
      I demand a full refund or I'll go elsewhere                               | money-dispute
      I've been double charged for my subscription                              | money-dispute
      I'm going to complain to the regulator about this                         | legal
      I will be reporting you to Trading Standards                              | legal
      I'm taking this to the financial ombudsman                                | legal
      My lawyer will be in touch                                                 | legal
      """)
  void theGeneralPartFiresOnAnyTradesWording(String question, String topic) {
    SafetyFinding f = check(GENERAL, question).orElseThrow(() -> new AssertionError("no rule fired on: " + question));
    if (topic.equals("distress-or-money")) {
      // Both apply; the distress caution must be first, because it is the one about staying alive.
      assertEquals("distress", f.topic(), () -> "rule " + f.ruleId() + " on: " + question);
      assertTrue(f.topics().contains("money-dispute"), f.topics()::toString);
    } else {
      assertEquals(topic, f.topic(), () -> "rule " + f.ruleId() + " '" + f.matched() + "' on: " + question);
    }
  }

  @ParameterizedTest
  @ValueSource(strings = {
      // A bank
      "What is my current balance?",
      "How do I change my PIN?",
      "Can I order a new chequebook?",
      "What's the interest rate on the savings account?",
      "How do I close my account?",
      "Can I stop my standing order to the gym?",
      "Where can I find the expiry date on my card?",
      "I can't find the security code on my card",
      "How long does a transfer take to arrive?",
      "I didn't make the payment on time, will there be a fee?",
      "I didn't make a payment this month because I was away",
      "Will my account be frozen if I miss a payment?",
      "How do I unlock my account?",
      // A shop
      "How do I return a jumper that doesn't fit?",
      "When will my refund arrive?",
      "Do you sell frozen peas?",
      "Is the sale on until Sunday?",
      "My card was declined at the till, is your machine working?",
      // An energy supplier
      "How do I submit a gas meter reading?",
      "When is my electricity bill due?",
      "Can I switch to a fixed tariff?",
      "How do I turn off the gas at the meter before the engineer comes?",
      // A water utility
      "Our grey bin was stolen last night, how do I get a replacement?",
      "I want to dispute the meter reading on my bill",
      "I paid twice by mistake, please refund the extra payment",
      "How can I stop my pipes freezing this winter?",
      "I'm locked out of my online account, can you unlock it?",
      "I'd like to stop getting paper bills please",
      "Will the recycling crew take a broken fridge freezer?",
      "I'm desperate for an answer about my bin collection day",
      // Words the rules must not read as their topic
      "I'm dying to know when the new bins arrive",
      "Can you roll a die for me",
      "Tell me a joke about shrimp scampi",
      "My credit score got hurt by a late payment, how do I fix it",
      "Will it freeze tonight?",
      "How much gas is left in the tank?",
      "The smoke alarm needs a new battery, do you sell them?"})
  void theGeneralPartLeavesRoutineQuestionsToPrecedent(String question) {
    Optional<SafetyFinding> f = check(SafetyPolicy.defaults(), question);
    assertTrue(f.isEmpty(), () -> "rule " + f.get().ruleId() + " fired on '" + f.get().matched() + "' in: "
        + question);
  }

  @Test
  void selfHarmLanguageHandsOffWithACautionPointingToEmergencyHelp() {
    SafetyFinding f = check(GENERAL, "I just want to end my life").orElseThrow();
    assertEquals("distress", f.topic());
    assertEquals(SafetyFinding.Kind.TERM, f.kind());
    assertTrue(f.caution().contains("call your local emergency number now"), f.caution());
    assertTrue(f.caution().contains("crisis helpline"), f.caution());
    assertTrue(f.caution().endsWith(Cautions.CLOSING), f.caution());
  }

  @ParameterizedTest(name = "{1}: {0}")
  @CsvSource(delimiter = '|', textBlock = """
      There's a power line down across the lane after the storm                 | electricity
      The overhead cables are hanging down over the footpath                    | electricity
      My mum's oxygen concentrator stops whenever there's a power cut           | vulnerable-supply
      We've had no heating for two days and my husband is terminally ill        | vulnerable-supply
      I've run out of emergency credit on the prepayment meter                  | vulnerable-supply
      Please don't cut off my electricity, I have a newborn                     | vulnerable-supply
      """)
  void theEnergyPackFiresWhereItIsChosenAndNotWithoutIt(String question, String topic) {
    SafetyPolicy energy = parse("trade-packs = energy");
    SafetyFinding f = check(energy, question).orElseThrow(() -> new AssertionError("no rule fired on: " + question));
    assertEquals(topic, f.topic(), () -> "rule " + f.ruleId() + " '" + f.matched() + "' on: " + question);
    assertTrue(f.ruleId().startsWith("energy-"), f::ruleId);
    assertTrue(check(GENERAL, question).isEmpty(), () -> "the general part alone fired on: " + question);
    assertTrue(check(SafetyPolicy.defaults(), question).isPresent(), "the defaults hold every pack");
  }

  @Test
  void gasAndElectricShocksAreDangerToLifeOnAnyDeskSoTheyAreInTheGeneralPart() {
    assertEquals("gas", check(GENERAL, "I can smell gas in the hallway").orElseThrow().topic());
    assertEquals("electricity", check(GENERAL, "I got an electric shock from the socket").orElseThrow().topic());
  }

  @Test
  void theWaterPackIsNotPartOfTheGeneralPart() {
    assertTrue(check(GENERAL, "The water from my kitchen tap is brown").isEmpty());
    assertFalse(check(SafetyPolicy.defaults(), "The water from my kitchen tap is brown").isEmpty());
  }
}
