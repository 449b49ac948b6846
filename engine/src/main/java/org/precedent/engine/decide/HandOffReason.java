package org.precedent.engine.decide;

/** Why a question went to a person. */
public enum HandOffReason {
  /** No past answer is close enough to propose anything. */
  NO_CANDIDATE,
  /** The question or its best answer falls under a safety rule. */
  SAFETY_RULE,
  /** The best answer group, or the ticket's category, is marked for people only. */
  HUMAN_ONLY,
  /**
   * The best answer still holds a redacted detail (a placeholder such as [PHONE]): as written it
   * lacks what a person must fill in, however sure the model is that it fits.
   */
  ANSWER_INCOMPLETE,
  /**
   * The best answer's past replies differ in a few places (a day, an amount, a reference): its
   * template has slots for this customer's own details, which a person must fill in.
   */
  NEEDS_CUSTOMER_DETAILS,
  /** The confidence is below the threshold in force. */
  BELOW_THRESHOLD,
  /**
   * The best answer is not approved in the service's answer library, and only approved answers
   * are sent automatically (api.answers).
   */
  ANSWER_NOT_APPROVED,
  /** The best answer is retired from the service's answer library (api.answers). */
  ANSWER_RETIRED
}
