package org.precedent.engine.decide;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class RerankerUseTest {
  @Test
  void theDefaultRunsTheRerankerOnlyWhereTheLegsDisagree() {
    assertEquals(RerankerUse.ON_DISAGREEMENT, RerankerUse.named(null));
    assertEquals(RerankerUse.ON_DISAGREEMENT, RerankerUse.named("  "));
  }

  @Test
  void eachSettingIsReadAsSpelt() {
    for (RerankerUse use : RerankerUse.values()) {
      assertEquals(use, RerankerUse.named(" " + use.setting().toUpperCase() + " "));
    }
  }

  @Test
  void anUnknownSettingNamesThePropertyAndTheValuesThereAre() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> RerankerUse.named("sometimes"));
    assertTrue(e.getMessage().contains("-Dprecedent.reranker=sometimes"), e.getMessage());
    assertTrue(e.getMessage().contains("on-disagreement"), e.getMessage());
  }
}
