package org.precedent.knowledge.group;

import java.util.List;
import java.util.Objects;

/**
 * Past replies that reuse one answer, once greetings, names and sign-offs are removed.
 *
 * @param id        a stable id: the label when groups come from a label column, else derived from
 *                  the canonical text
 * @param canonical the answer's canonical text: the most frequent cleaned reply in the group
 * @param label     the label that defined the group, or null when found from the replies
 * @param category  the most frequent category among its tickets, or null
 * @param ticketIds the tickets answered with it, sorted
 * @param template  the answer with the places where its replies differ marked as slots
 *                  ({@link Slots}), or null when they agree; absent from files written before
 *                  slots, which read as null
 */
public record AnswerGroup(String id, String canonical, String label, String category,
    List<String> ticketIds, String template) {
  public AnswerGroup {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(canonical, "canonical");
    ticketIds = List.copyOf(ticketIds);
    if (template != null && !Slots.hasSlots(template)) {
      throw new IllegalArgumentException("group " + id + ": template holds no slot: " + template);
    }
  }

  /** A group whose replies agree: no template. */
  public AnswerGroup(String id, String canonical, String label, String category,
      List<String> ticketIds) {
    this(id, canonical, label, category, ticketIds, null);
  }

  /** The answer to show: the template when the replies differ, else the canonical reply. */
  public String answer() {
    return template != null ? template : canonical;
  }

  /** How many past tickets this answer resolved. */
  public int size() {
    return ticketIds.size();
  }
}
