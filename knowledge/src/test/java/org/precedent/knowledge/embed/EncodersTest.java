package org.precedent.knowledge.embed;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Optional;
import org.junit.jupiter.api.Test;

class EncodersTest {
  @Test
  void unsetMeansTheDefaultEncoderAndNoneMeansBm25Only() {
    assertEquals(Optional.of(SentenceEncoder.BGE_SMALL_EN_V15_Q), Encoders.named(null));
    assertEquals(Optional.of(SentenceEncoder.BGE_SMALL_EN_V15_Q), Encoders.named("  "));
    assertEquals(Optional.empty(), Encoders.named("none"));
    assertEquals(Optional.of(SentenceEncoder.BGE_SMALL_EN_V15_Q),
        Encoders.named(" bge-small-en-v1.5-q "));
  }

  @Test
  void anUnknownEncoderIsRefusedNamingTheOnesThereAre() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> Encoders.named("bge-large"));
    assertTrue(e.getMessage().contains("bge-large") && e.getMessage().contains("bge-small-en-v1.5-q")
        && e.getMessage().contains("none"), e.getMessage());
  }
}
