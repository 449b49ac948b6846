package org.precedent.engine.learn;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Collections;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.TreeMap;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;

/**
 * The cap on training pairs per answer group: the same tickets whatever their order, every group
 * kept, no group above the cap, and a group under it kept whole.
 */
class PairsPerGroupTest {

  @Test
  void theCapKeepsEveryGroupAndTheSameTicketsInAnyOrder() {
    // 3 groups of 50, 7 and 1 tickets.
    Map<String, String> groupOf = new TreeMap<>();
    List<String> ids = new ArrayList<>();
    int[] sizes = {50, 7, 1};
    for (int g = 0; g < sizes.length; g++) {
      for (int k = 0; k < sizes[g]; k++) {
        String id = "T-" + g + "-" + k;
        groupOf.put(id, "G" + g);
        ids.add(id);
      }
    }
    List<String> kept = TeamModelTrainer.capPerGroup(ids, groupOf, 10);
    Map<String, Long> perGroup = kept.stream()
        .collect(Collectors.groupingBy(groupOf::get, TreeMap::new, Collectors.counting()));
    assertEquals(Map.of("G0", 10L, "G1", 7L, "G2", 1L), perGroup);

    List<String> shuffled = new ArrayList<>(ids);
    Collections.shuffle(shuffled, new Random(7));
    assertEquals(new HashSet<>(kept), new HashSet<>(TeamModelTrainer.capPerGroup(shuffled, groupOf, 10)),
        "the choice depends on the tickets' order");
    // Not simply the first ten by id: the hash spreads the choice over the group.
    assertTrue(!new HashSet<>(kept).containsAll(ids.subList(0, 10)), "the first ten ids were kept");
    assertEquals(ids, TeamModelTrainer.capPerGroup(ids, groupOf, 0), "0 must keep every ticket");
    assertThrows(IllegalArgumentException.class, () -> TeamModelTrainer.capPerGroup(ids, groupOf, -1));
  }
}
