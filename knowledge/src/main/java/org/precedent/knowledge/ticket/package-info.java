/**
 * The ticket record every part of Precedent shares: one resolved help-desk exchange as it is kept,
 * its question and reply already cleaned and redacted. {@link org.precedent.knowledge.ticket.Ticket}
 * is a plain record that crosses module boundaries (ingest writes it, the store keeps it, retrieval
 * indexes it, training learns from it); {@link org.precedent.knowledge.ticket.Category} is the one
 * rule for reading and comparing a category. So this package depends on the JDK alone and on no other
 * package of Precedent; everything else may depend on it.
 */
package org.precedent.knowledge.ticket;
