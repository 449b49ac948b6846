package org.precedent.demo;

/**
 * One generated demo ticket, as written to the demo CSV files.
 *
 * @param ticketId the ticket id, {@code T-100001} for training history and {@code H-500001} for held-out
 * @param subject  the customer's subject line, possibly empty
 * @param body     the customer's message, with greetings, sign-offs, quoted text and personal data left in
 * @param reply    the agent's reply as it was sent
 * @param category the queue the ticket was filed under (billing, collections, safety, complaint, ...)
 * @param created  when the ticket was opened, as an ISO-8601 instant
 * @param template the generator's answer key: the catalogue key of the reused answer, or a unique
 *                 {@code oneoff-NNNNNN} key for a ticket whose reply was written for it alone. Ingest must not
 *                 read it; it exists so that tests can measure how well answers are grouped.
 */
public record DemoTicket(
    String ticketId, String subject, String body, String reply, String category, String created, String template) {

  /** Whether this ticket's reply was written for it alone rather than reused from the catalogue. */
  public boolean isOneOff() {
    return template.startsWith(DemoOneOffs.KEY_PREFIX);
  }
}
