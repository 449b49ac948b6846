/**
 * The durable ticket queue: {@link org.precedent.api.queue.QueueController} accepts a ticket ({@code
 * /api/v1/queue/tickets}) only once {@link org.precedent.api.queue.TicketQueue} has committed it, one
 * {@link org.precedent.api.queue.QueueWorker} thread claims and decides queued tickets with a
 * conditional update and stores each decision in the transaction that marks the ticket decided, a
 * ticket that keeps failing ends as {@code FAILED} for a person, {@link
 * org.precedent.api.queue.QueueListing} lists the tickets for agents (newest first, by state, hand-off
 * reason and text, a page at a time), and {@link
 * org.precedent.api.queue.QueueHealth} reports the worker. It depends on {@code api.system}, on {@code
 * api.decision} (the {@code Decider}, which decides the stored question as cleaned, and the
 * decision's view), {@code api.answers} (the library's gate on what is sent), {@code
 * engine.decide} (the hand-off reasons), {@code knowledge.clean}, Spring (web, JDBC, transactions), HikariCP, Micrometer and
 * Jackson; only {@code api.cli} depends on it, for the queue benchmark ({@link
 * org.precedent.api.queue.QueueDrain}). Claims carry the replica's id and a lease ({@link
 * org.precedent.api.queue.ReplicaId}), so replicas on one PostgreSQL share the queue.
 */
package org.precedent.api.queue;
