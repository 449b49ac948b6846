package org.precedent.engine.rerank;

import java.util.ArrayList;
import java.util.List;

/**
 * A small made-up help desk: a few answers, each asked several ways. Enough for the network to learn
 * something in seconds, which the mechanics tests (masking, saving, resuming) need; the test of how well
 * the reranker learns uses CLINC150 instead.
 */
public final class TinyData {

  public static final List<String> ANSWERS = List.of(
      "You can reset your password from the sign-in page with the forgot password link.",
      "Your card has been blocked; call us at [PHONE] to unblock it.",
      "Refunds reach your account within five working days.",
      "We have updated the email address on your profile to [EMAIL].",
      "Invoices are under billing, then documents, in your account.",
      "Delivery takes two to four days after dispatch.");

  private static final List<List<String>> QUESTIONS = List.of(
      List.of("I forgot my password", "how do I reset my password?", "cannot log in, password lost",
          "password reset please", "locked out, forgot the password", "where do I change a forgotten password"),
      List.of("my card is blocked", "card stopped working, blocked?", "why was my card blocked",
          "unblock my card please", "the card [CARD] is blocked", "card declined and blocked"),
      List.of("when will I get my refund", "refund not received yet", "how long does a refund take",
          "where is my refund money", "refund status?", "I am waiting for a refund"),
      List.of("please change my email to [EMAIL]", "update my email address", "new email address for my profile",
          "change the email on my account", "my email changed, update it", "use [EMAIL] as my email"),
      List.of("where can I find my invoice", "download an invoice", "I need last month's invoice",
          "invoice copy please", "how do I get invoices", "where are my invoices kept"),
      List.of("when will my order arrive", "how long is delivery", "delivery time for my order",
          "my parcel has not arrived", "when is delivery", "shipping takes how long"));

  private TinyData() {}

  public static List<TrainingPair> pairs() {
    List<TrainingPair> out = new ArrayList<>();
    for (int round = 0; round < 2; round++) {
      for (int a = 0; a < ANSWERS.size(); a++) {
        for (String q : QUESTIONS.get(a)) {
          out.add(new TrainingPair(round == 0 ? q : q + " thanks", ANSWERS.get(a)));
        }
      }
    }
    return out;
  }

  /** Small sizes so a model trains in seconds. */
  public static RerankerConfig config() {
    return RerankerConfig.defaults().withSizes(8, 16).withEpochs(25, 4).withBatchSize(8).withVocabulary(500, 1)
        .withLearningRate(1e-2);
  }
}
