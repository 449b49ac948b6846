package org.precedent.api.answers;

import java.util.List;

/**
 * An answer of the library as callers see it.
 *
 * @param groupId           the answer group it stands for
 * @param title             a readable name (made from the category and distinctive words; editable)
 * @param text              the text sent when the answer is approved
 * @param state             DRAFTED (made by grouping), APPROVED or RETIRED
 * @param version           raised by every change; a change names the version it was made on
 * @param edited            a person changed the text
 * @param category          the group's most frequent category, or null
 * @param sources           the past tickets whose replies are behind it
 * @param groupText         the group's own text (template or canonical reply) as last synced
 * @param slots             the slot names of the text (knowledge.group.Slots)
 * @param changedUnderneath the group's replies changed since a person approved, edited or retired it
 * @param present           the group is in the knowledge in force
 * @param uses              automatic replies the queue sent with it
 * @param accepted          agents' feedback: sent as suggested
 * @param editedByAgents    agents' feedback: sent after editing
 * @param rejected          agents' feedback: not used
 * @param updatedAt         when it last changed
 */
public record StoredAnswer(String groupId, String title, String text, String state, int version,
    boolean edited, String category, List<String> sources, String groupText, List<String> slots,
    boolean changedUnderneath, boolean present, long uses, long accepted, long editedByAgents,
    long rejected, String updatedAt) {
  /** The states of an answer. */
  public enum State { DRAFTED, APPROVED, RETIRED }
}
