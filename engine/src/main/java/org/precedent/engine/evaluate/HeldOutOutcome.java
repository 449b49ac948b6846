package org.precedent.engine.evaluate;

/**
 * What the system the service decides with (the fused one) did with one held-out ticket, kept in
 * the report so that the approval gate's effect can be counted later against the library's
 * approved answers (the service's threshold page, {@code evaluate}).
 *
 * @param ticketId    the held-out ticket
 * @param answerGroup the group of the answer it would send, or null when it had no candidate
 * @param confidence  its confidence in that answer
 * @param right       whether that answer is the ticket's right one
 * @param safetyGate  whether the gate before the threshold hands the ticket off whatever the
 *                    confidence
 */
public record HeldOutOutcome(String ticketId, String answerGroup, double confidence, boolean right,
    boolean safetyGate) {
  static HeldOutOutcome of(EvaluatedTicket t) {
    return new HeldOutOutcome(t.ticketId(), t.answerGroup(), t.confidence(), t.replyRight(),
        t.safetyGate());
  }

  /** Whether the service would reply at {@code threshold}, before any approval gate. */
  public boolean replied(double threshold) {
    return !safetyGate && answerGroup != null && confidence >= threshold;
  }
}
