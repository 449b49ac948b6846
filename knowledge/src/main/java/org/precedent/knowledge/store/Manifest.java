package org.precedent.knowledge.store;

import java.time.Instant;
import java.util.List;

/**
 * What a knowledge generation holds, written beside it.
 *
 * @param written        when the generation was written
 * @param tickets        number of tickets
 * @param groups         number of answer groups
 * @param oneOffs        number of one-off tickets
 * @param groupingMethod how the groups were formed
 * @param sources        the files ingested into it, oldest first
 */
public record Manifest(Instant written, int tickets, int groups, int oneOffs, String groupingMethod,
    List<String> sources) {
  public Manifest {
    sources = List.copyOf(sources);
  }
}
