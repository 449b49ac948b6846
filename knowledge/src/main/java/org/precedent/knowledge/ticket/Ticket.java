package org.precedent.knowledge.ticket;

import java.time.Instant;
import java.util.Objects;

/**
 * One resolved ticket as Precedent keeps it: question and reply already cleaned and redacted.
 *
 * @param id       the ticket id from the source system; re-ingesting the same id replaces the ticket
 * @param question the customer's question (subject and body joined), cleaned
 * @param reply    the agent's reply, cleaned; for labelled data without replies, the label in words
 * @param label    the answer-group label from a mapped label column, or null when groups are found from replies
 * @param category an optional category (billing, collections, ...), or null
 * @param created  when the ticket was opened, or null when the source does not say
 */
public record Ticket(String id, String question, String reply, String label, String category, Instant created) {
  public Ticket {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(question, "question");
    Objects.requireNonNull(reply, "reply");
    if (id.isBlank()) {
      throw new IllegalArgumentException("ticket id is blank");
    }
  }
}
