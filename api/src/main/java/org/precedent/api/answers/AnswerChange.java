package org.precedent.api.answers;

/**
 * One audited change of an answer: who, when, before, after, why.
 *
 * @param version the answer's version this change made
 * @param action  CREATED, EDITED, APPROVED, RETIRED or REGROUPED (the group's replies changed)
 */
public record AnswerChange(long id, String groupId, int version, String action, String changedBy,
    String changedAt, String oldTitle, String newTitle, String oldText, String newText,
    String oldState, String newState, String reason) {}
