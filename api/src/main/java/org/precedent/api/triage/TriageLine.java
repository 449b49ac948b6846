package org.precedent.api.triage;

import org.precedent.api.decision.DecisionView;
import org.precedent.knowledge.ingest.NewTicket;

/**
 * One line of triage output (JSON Lines): the service's view of the decision, flat, without
 * candidates.
 *
 * @param id           the ticket's id
 * @param line         the input line it came from
 * @param outcome      REPLY or HAND_OFF; absent when the row had an error
 * @param reason       why it was handed off (lower case)
 * @param confidence   calibrated chance that the best answer is right
 * @param threshold    the threshold in force for its category
 * @param answerGroup  the best answer's id
 * @param reply        the automatic reply, for REPLY only
 * @param caution      what the customer should do now, when a safety rule fired
 * @param explanation  the decision in a sentence or two
 * @param modelVersion the model version that decided
 * @param error        what is wrong with the row, instead of a decision
 */
record TriageLine(String id, long line, String outcome, String reason, Double confidence,
    Double threshold, String answerGroup, String reply, String caution, String explanation,
    String modelVersion, String error) {

  static TriageLine of(NewTicket t, DecisionView d) {
    return new TriageLine(t.id(), t.line(), d.outcome(), d.reason(), d.confidence(),
        d.threshold(), d.answerGroup(), d.reply(), d.caution(), d.explanation(), d.modelVersion(),
        null);
  }

  static TriageLine failed(NewTicket t) {
    return new TriageLine(t.id(), t.line(), null, null, null, null, null, null, null, null, null,
        t.problem().toString());
  }
}
