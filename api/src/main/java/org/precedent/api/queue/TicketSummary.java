package org.precedent.api.queue;

/**
 * One row of the queue's list: where a ticket is and, once decided, what was decided, without the
 * decision's candidates and explanation (those come with the ticket itself).
 *
 * @param ticketId    the caller's id for it
 * @param state       RECEIVED (waiting or being decided), REPLIED, HANDED_OFF or FAILED
 * @param status      the queue's own status: QUEUED, DECIDING, DECIDED or FAILED
 * @param attempts    how many times a decision was started
 * @param failure     why the last try failed, if it did (and the ticket is not decided since)
 * @param question    the start of the question as stored (cleaned and redacted), at most
 *                    {@link QueueListing#QUESTION_CHARS} characters
 * @param category    its category, if given
 * @param reason      why it was handed off (lower case), for a hand-off
 * @param confidence  the decision's calibrated confidence, once decided
 * @param threshold   the confidence that was needed to reply, once decided
 * @param submittedAt when it was stored (ISO-8601)
 * @param decidedAt   when it was decided, if it was
 */
record TicketSummary(String ticketId, String state, String status, int attempts, String failure,
    String question, String category, String reason, Double confidence, Double threshold,
    String submittedAt, String decidedAt) {}
