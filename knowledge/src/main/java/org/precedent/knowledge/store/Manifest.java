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
 * @param vectors        the encoder whose vectors of the questions the index holds, or null when
 *                       it holds none (BM25 only, or a generation written before there were any)
 */
public record Manifest(Instant written, int tickets, int groups, int oneOffs, String groupingMethod,
    List<String> sources, Vectors vectors) {
  public Manifest {
    sources = List.copyOf(sources);
  }

  /**
   * What made a generation's question vectors: a different encoder means different vectors, so a
   * query embedded by another one must not be compared with them.
   *
   * @param encoder   the encoder's name
   * @param sha256    the SHA-256 of its model file
   * @param dimension the vectors' length
   */
  public record Vectors(String encoder, String sha256, int dimension) {}
}
