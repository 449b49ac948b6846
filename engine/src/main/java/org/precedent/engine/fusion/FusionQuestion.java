package org.precedent.engine.fusion;

/**
 * A question that fusion and calibration are fitted on.
 *
 * @param ticketId   its ticket id
 * @param question   the cleaned question
 * @param rightGroup the answer group that resolves it, or null when none does
 * @param stored     true when the ticket is in the index, so retrieval must leave it out
 */
public record FusionQuestion(String ticketId, String question, String rightGroup, boolean stored) {}
