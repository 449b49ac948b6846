package org.precedent.knowledge.group;

import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.stream.Collectors;
import java.util.function.Function;

/**
 * The answer groups of a ticket collection, and the one-off tickets that belong to none.
 *
 * @param groups     answer groups, largest first
 * @param oneOffs    ids of tickets whose reply was not reused: kept as reference, never proposed as
 *                   automatic replies
 * @param method     how the groups were formed, for reports
 */
public record Grouping(List<AnswerGroup> groups, List<String> oneOffs, String method) {
  public Grouping {
    groups = List.copyOf(groups);
    oneOffs = List.copyOf(oneOffs);
  }

  /** Group id by ticket id, for every grouped ticket. */
  public Map<String, String> groupOfTicket() {
    return groups.stream().flatMap(g -> g.ticketIds().stream().map(t -> Map.entry(t, g.id())))
        .collect(Collectors.toUnmodifiableMap(Map.Entry::getKey, Map.Entry::getValue));
  }

  /** Groups by id. */
  public Map<String, AnswerGroup> byId() {
    return groups.stream().collect(Collectors.toUnmodifiableMap(AnswerGroup::id, Function.identity()));
  }

  public Optional<AnswerGroup> group(String id) {
    return groups.stream().filter(g -> g.id().equals(id)).findFirst();
  }
}
