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
 */
public record AnswerGroup(String id, String canonical, String label, String category,
    List<String> ticketIds) {
  public AnswerGroup {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(canonical, "canonical");
    ticketIds = List.copyOf(ticketIds);
  }

  /** How many past tickets this answer resolved. */
  public int size() {
    return ticketIds.size();
  }
}
