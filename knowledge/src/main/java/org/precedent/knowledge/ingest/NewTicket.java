package org.precedent.knowledge.ingest;

/**
 * A ticket not yet answered, read from an export by the rules ingest reads resolved ones by.
 *
 * @param id       its id (the id column, else file name and line)
 * @param line     the line of the export it starts on (1-based)
 * @param question the question, cleaned and redacted as ingest cleans one; null when {@code problem}
 * @param category its category ({@link org.precedent.knowledge.ticket.Category}), or null
 * @param problem  why it cannot be decided, saying where; null when it can
 */
public record NewTicket(String id, long line, String question, String category,
    RowProblem problem) {}
