package org.precedent.engine.safety;

import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Set;

/**
 * The short, calm notes shown to a customer when Precedent hands a ticket to a person instead of replying.
 *
 * <p>Every caution ends with {@link #CLOSING}: whatever the topic, the customer learns that a person will follow
 * up, and that official notices and emergency-service instructions outrank anything we write here. The closing is
 * added by this class, not by each text, so that a caution written in a policy file cannot leave it out.
 */
public final class Cautions {

  /** The phrase used for the utility's emergency line when a policy does not name a number. */
  public static final String DEFAULT_EMERGENCY_LINE = "our emergency line";

  /** The sentence every caution ends with. */
  static final String CLOSING = "Someone from our team will follow up with you personally. "
      + "Local public-health notices and instructions from the emergency services always come first.";

  /** Where a topic's text names the utility's emergency line. */
  static final String EMERGENCY_LINE_SLOT = "{emergency-line}";

  private static final Map<String, String> BY_TOPIC = Map.ofEntries(
      // The general part, for any help desk.
      Map.entry("distress", "If you are thinking about ending your life or harming yourself, or you don't feel safe "
          + "right now, please call your local emergency number now, or talk to a crisis helpline or someone you "
          + "trust. You don't have to wait for us, and you don't have to deal with this alone."),
      Map.entry("emergency", "If anyone is hurt or in danger, or is having trouble breathing, call your local "
          + "emergency number now. If there is fire or smoke, get everyone out and don't go back in."),
      Map.entry("gas", "If you smell gas or think there may be carbon monoxide, get everyone out into fresh air, "
          + "don't use light switches or anything that could make a spark, and call the gas emergency number once "
          + "you're outside."),
      Map.entry("electricity", "Please keep away from anything that is sparking or may be live, and don't touch "
          + "switches or sockets near water. Call your electricity network operator's emergency number, and if "
          + "someone has had a shock, call the emergency services."),
      Map.entry("account-security", "If you think someone else has got into your account, change your password from "
          + "a device you trust, and don't share passwords, PINs or one-time codes with anyone, including someone "
          + "who says they are from us. A person will act on your request and check your account for anything you "
          + "didn't do."),
      Map.entry("lost-stolen", "If a card, cheque book or other way of paying has been lost or stolen, contact the "
          + "bank or card issuer straight away on a number you already trust, such as the one on their website, so "
          + "they can stop it being used. We will never ask you for your PIN or your full card number by email."),
      Map.entry("fraud", "If you think someone has used your account or card without your permission, contact your "
          + "bank or card issuer now on a number you already trust, not one given in a message or a call, and "
          + "don't share passwords, PINs or one-time codes with anyone. Please don't pay anything you are unsure "
          + "of until a person has checked it with you."),
      Map.entry("money-dispute", "Because your message concerns a disputed charge, refund or debt, or a claim for "
          + "money, we haven't sent an automatic answer; a person will review your account and your message."),
      Map.entry("legal", "Because your message concerns a legal matter or a complaint to a regulator or ombudsman, "
          + "we haven't sent an automatic answer; a person will review it."),
      // The water & waste pack.
      Map.entry("water-quality", "Please don't drink the water or use it for cooking while it looks discoloured or "
          + "smells or tastes strange. Run the cold kitchen tap for a few minutes, and if it doesn't clear, please "
          + "call " + EMERGENCY_LINE_SLOT + "."),
      Map.entry("sewage", "Please keep children and pets away from the flood water and don't touch it; if you have, "
          + "wash your hands well with soap and warm water. Please call " + EMERGENCY_LINE_SLOT
          + " so we can send a team."),
      Map.entry("burst-main", "Please keep well away from the water, and don't drive or walk through it. Please call "
          + EMERGENCY_LINE_SLOT + " so we can make the area safe."),
      Map.entry("health", "If you or anyone in your home feels unwell, please seek medical advice. If it might be "
          + "linked to your water, please don't drink it until it has been checked."),
      // The energy pack.
      Map.entry("vulnerable-supply", "If someone in your home relies on medical equipment, or is at risk without "
          + "heating or power, and their life may be in danger, call your local emergency number now. A person "
          + "will look at your supply and your account before anything else, and can tell you about priority "
          + "help."));

  private static final String GENERAL = "We haven't sent an automatic answer to your message; it has been passed "
      + "to a member of our team.";

  private Cautions() {
  }

  /** The caution for a topic, naming the emergency line as {@value #DEFAULT_EMERGENCY_LINE}. */
  public static String forTopic(String topic) {
    return forTopic(topic, DEFAULT_EMERGENCY_LINE);
  }

  /**
   * The caution for a topic. A topic without a built-in text (one a policy file introduced) gets the general
   * caution, because any hand-off is better explained generally than not at all.
   *
   * @param emergencyLine how to name the emergency line, e.g. "our emergency line on 01632 960999"
   */
  public static String forTopic(String topic, String emergencyLine) {
    Objects.requireNonNull(topic, "topic");
    String text = BY_TOPIC.get(topic.toLowerCase(Locale.ROOT));
    return text == null ? general() : compose(text, emergencyLine);
  }

  /** The caution for a hand-off that no term caused: a human-only answer group or category. */
  public static String general() {
    return compose(GENERAL, DEFAULT_EMERGENCY_LINE);
  }

  /** Whether a topic has a built-in text. */
  static boolean hasBuiltIn(String topic) {
    return BY_TOPIC.containsKey(topic);
  }

  /**
   * One text from the cautions of several matched rules, in the order given: each distinct text once, the closing
   * sentence once at the end, so that the customer reads every piece of advice that applies, the first match's first.
   */
  static String combine(List<String> cautions) {
    if (cautions.isEmpty()) {
      throw new IllegalArgumentException("no caution to combine");
    }
    Set<String> bodies = new LinkedHashSet<>();
    for (String caution : cautions) {
      String body = caution.strip();
      if (body.endsWith(CLOSING)) {
        body = body.substring(0, body.length() - CLOSING.length()).strip();
      }
      if (!body.isEmpty()) {
        bodies.add(body);
      }
    }
    return bodies.isEmpty() ? CLOSING : String.join(" ", bodies) + " " + CLOSING;
  }

  /** A caution from a topic-specific text: the emergency line filled in and the closing sentence added. */
  static String compose(String text, String emergencyLine) {
    Objects.requireNonNull(text, "text");
    if (emergencyLine == null || emergencyLine.isBlank()) {
      throw new IllegalArgumentException("emergency line must not be blank");
    }
    String body = text.strip().replace(EMERGENCY_LINE_SLOT, emergencyLine.strip());
    if (body.isEmpty()) {
      throw new IllegalArgumentException("caution text must not be blank");
    }
    if (body.endsWith(CLOSING)) {
      return body;
    }
    return body + " " + CLOSING;
  }
}
