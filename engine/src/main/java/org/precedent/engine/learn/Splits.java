package org.precedent.engine.learn;

import java.nio.charset.StandardCharsets;
import java.util.zip.CRC32;

/**
 * Which stored tickets the reranker trains on and which are kept apart for fitting fusion and
 * calibration. Decided by a hash of the ticket id, so the split is the same on every run and a
 * re-ingested ticket stays on its side.
 */
public final class Splits {
  /** Share of tickets kept apart for fusion and calibration (common practice, no source). */
  public static final double FUSION_SHARE = 0.2;

  private Splits() {}

  public static boolean isFusionTicket(String ticketId) {
    CRC32 crc = new CRC32();
    crc.update(ticketId.getBytes(StandardCharsets.UTF_8));
    return crc.getValue() % 1000 < FUSION_SHARE * 1000;
  }
}
