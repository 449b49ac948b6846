package org.precedent.api.decision;

import java.util.List;
import java.util.Locale;
import org.precedent.engine.decide.Decision;
import org.precedent.engine.explain.Explanation;

/**
 * A decision as the service shows it.
 *
 * @param outcome      REPLY or HAND_OFF
 * @param reason       why it was handed off (lower case), absent for a reply
 * @param question     the question as cleaned and redacted
 * @param answerGroup  the best answer's id, absent when nothing matched
 * @param reply        the automatic reply, present only for REPLY
 * @param confidence   calibrated chance that the best answer (the first candidate) is right: the
 *                     one figure to trust; candidates carry no chance of their own
 * @param threshold    the confidence needed for an automatic reply in this category
 * @param caution      what the customer should do now; present when a safety rule fired
 * @param safetyTopic  the safety rule's topic, when one fired
 * @param explanation  the decision in a sentence or two
 * @param why          the same as a tree of named contributions (the confidence as the Platt
 *                     calibration of a logit, the logit as its terms, the threshold, the gate)
 * @param truncated    the question was longer than the model reads and was cut
 * @param modelVersion the model version that decided
 * @param candidates   ranked answers, best first
 * @param template     the best answer with its slots marked (knowledge.group.Slots) when past
 *                     customers got it with their own details, else absent
 */
public record DecisionView(String outcome, String reason, String question, String answerGroup,
    String reply, double confidence, double threshold, String caution, String safetyTopic,
    String explanation, Explanation why, boolean truncated, String modelVersion, List<CandidateView> candidates,
    String template) {

  public static DecisionView of(Decision d, String modelVersion, int limit) {
    List<CandidateView> shown = new java.util.ArrayList<>();
    for (int i = 0; i < Math.min(limit, d.candidates().size()); i++) {
      shown.add(CandidateView.of(i + 1, d.candidates().get(i)));
    }
    return new DecisionView(d.outcome().name(),
        d.reason() == null ? null : d.reason().name().toLowerCase(Locale.ROOT), d.question(),
        d.answerGroup(), d.reply(), d.confidence(), d.threshold(), d.caution(),
        d.safety() == null ? null : d.safety().topic(), d.explanation(), d.why(), d.truncated(),
        modelVersion, List.copyOf(shown),
        // The best answer's template, its slots marked, for the agent to fill in.
        d.candidates().isEmpty() ? null : d.candidates().get(0).candidate().group().template());
  }
}
