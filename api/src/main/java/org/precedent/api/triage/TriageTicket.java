package org.precedent.api.triage;

/**
 * One new ticket to decide.
 *
 * @param id       its id (the id column, else file name and line)
 * @param line     the line of the input it starts on
 * @param question the question as read (cleaned when decided)
 * @param category its category, or null
 * @param error    why the row cannot be decided (it is reported in the output), or null
 */
public record TriageTicket(String id, long line, String question, String category, String error) {}
