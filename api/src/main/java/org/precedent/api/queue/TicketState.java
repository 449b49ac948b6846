package org.precedent.api.queue;

/** Where a queued ticket is; stored by name in {@code queue_ticket.status}. */
enum TicketState {
  /** Stored and waiting for the worker. */
  QUEUED,
  /** Taken by a worker, which is deciding it now. */
  DECIDING,
  /** Its decision is stored. */
  DECIDED,
  /** No decision could be made in {@link TicketQueue#MAX_ATTEMPTS} tries: a person must take it. */
  FAILED
}
