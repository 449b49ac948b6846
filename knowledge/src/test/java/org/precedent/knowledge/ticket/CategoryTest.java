package org.precedent.knowledge.ticket;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertNull;

import org.junit.jupiter.api.Test;

class CategoryTest {

  @Test
  void absentAndBlankCategoriesAreNone() {
    assertNull(Category.normalise(null));
    assertNull(Category.normalise(""));
    assertNull(Category.normalise(" \t\n"));
    assertNull(Category.key("  "));
  }

  @Test
  void spacesAtEitherEndGoAndInnerOnesStay() {
    assertEquals("missed bin", Category.normalise("  missed bin \t"));
  }

  @Test
  void composedAndDecomposedLettersAreOneCategory() {
    // Unicode Standard Annex #15 (Normalization Forms): "e" followed by U+0301 COMBINING ACUTE
    // ACCENT is canonically equivalent to U+00E9, and NFC composes it.
    String decomposed = "Caf" + "e\u0301";
    assertNotEquals("Caf\u00e9", decomposed);
    assertEquals("Caf\u00e9", Category.normalise(decomposed));
    assertEquals(Category.key("CAF\u00c9"), Category.key(decomposed));
  }

  @Test
  void categoriesAreComparedWithoutCase() {
    assertEquals("billing", Category.key(" Billing"));
    assertEquals("Billing", Category.normalise(" Billing"), "shown as written");
  }
}
