package org.precedent.api.queue;

import org.precedent.api.decision.DecisionView;

/**
 * A queued ticket and, once made, its decision.
 *
 * @param ticketId    the caller's id for it
 * @param status      QUEUED (waiting), DECIDING (being decided), DECIDED, or FAILED (could not be
 *                    decided after several tries: a person must take it)
 * @param attempts    how many times a decision was started
 * @param failure     why the last try failed, if it did (and the ticket is not decided since)
 * @param question    the question as stored: cleaned and redacted
 * @param category    its category, if given
 * @param submittedAt when it was stored (ISO-8601)
 * @param decidedAt   when it was decided, if it was
 * @param decision    the decision, once made
 */
record TicketView(String ticketId, String status, int attempts, String failure, String question,
    String category, String submittedAt, String decidedAt, DecisionView decision) {}
