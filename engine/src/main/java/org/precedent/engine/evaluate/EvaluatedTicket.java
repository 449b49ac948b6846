package org.precedent.engine.evaluate;

import java.util.Objects;
import org.precedent.engine.measure.RankedOutcome;
import org.precedent.engine.measure.JudgedAnswer;

/**
 * How one system did on one held-out ticket.
 *
 * <p>The automatic reply would be the system's top candidate, so it is right only when the ticket is
 * in scope and the right answer is ranked first. An out-of-scope ticket has no right answer: replying
 * to it at all is a mistake, which is why it must carry rank 0.
 *
 * @param ticketId    identifies the ticket across systems, so that runs can be checked to cover the
 *                    same tickets
 * @param category    the ticket's category, for the per-category table
 * @param inScope     whether some past answer is right for this ticket
 * @param rankOfRight 1-based rank of the right answer among the candidates; 0 when it is absent or
 *                    the ticket is out of scope
 * @param confidence  the system's confidence in its top candidate, in [0, 1]
 * @param safetyGate  whether the gate before the threshold (a safety rule, a people-only category
 *                    or answer, an answer lacking a redacted detail) hands this ticket to a person
 *                    in service, whatever the confidence
 * @param answerGroup the group of the system's top candidate (the answer it would send), or null
 *                    when it had none or it was not recorded: the approval gate looks it up
 * @param reranked    whether the system ran the reranker for this ticket
 */
public record EvaluatedTicket(String ticketId, String category, boolean inScope, int rankOfRight,
    double confidence, boolean safetyGate, String answerGroup, boolean reranked) {
  /** A ticket for a system whose use of the reranker is not measured. */
  public EvaluatedTicket(String ticketId, String category, boolean inScope, int rankOfRight,
      double confidence, boolean safetyGate, String answerGroup) {
    this(ticketId, category, inScope, rankOfRight, confidence, safetyGate, answerGroup, false);
  }

  /** A ticket the safety gate lets through to the threshold. */
  public EvaluatedTicket(String ticketId, String category, boolean inScope, int rankOfRight,
      double confidence) {
    this(ticketId, category, inScope, rankOfRight, confidence, false, null);
  }

  /** A ticket whose top candidate's group is not recorded. */
  public EvaluatedTicket(String ticketId, String category, boolean inScope, int rankOfRight,
      double confidence, boolean safetyGate) {
    this(ticketId, category, inScope, rankOfRight, confidence, safetyGate, null);
  }

  public EvaluatedTicket {
    Objects.requireNonNull(ticketId, "ticket id");
    Objects.requireNonNull(category, "category");
    if (ticketId.isBlank()) {
      throw new IllegalArgumentException("ticket id is blank");
    }
    if (rankOfRight < 0) {
      throw new IllegalArgumentException("ticket " + ticketId + ": rank of the right answer is negative");
    }
    if (!inScope && rankOfRight != 0) {
      throw new IllegalArgumentException(
          "ticket " + ticketId + " is out of scope, so it has no right answer to rank; use rank 0");
    }
    if (!(confidence >= 0.0 && confidence <= 1.0)) {
      throw new IllegalArgumentException("ticket " + ticketId + ": confidence " + confidence + " is outside [0, 1]");
    }
  }

  /** Whether the automatic reply (the top candidate) would have been right. */
  boolean replyRight() {
    return inScope && rankOfRight == 1;
  }

  /** The ticket as the measures see it: the confidence, and whether the top answer was right. */
  public JudgedAnswer scored() {
    return new JudgedAnswer(confidence, replyRight());
  }

  RankedOutcome ranked() {
    return new RankedOutcome(rankOfRight);
  }
}
