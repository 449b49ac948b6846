package org.precedent.knowledge.retrieve;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Random;
import org.junit.jupiter.api.Test;

/** The proximity's dot product against the plain definition, sum of a[i] * b[i], in one sum. */
class DotProductTest {
  @Test
  void fourSumsGiveTheDefinitionsValueAtEveryLength() {
    Random random = new Random(7);
    for (int n = 0; n <= 13; n++) {
      float[] a = new float[n];
      float[] b = new float[n];
      double plain = 0;
      for (int i = 0; i < n; i++) {
        a[i] = random.nextFloat() - 0.5f;
        b[i] = random.nextFloat() - 0.5f;
        plain += a[i] * b[i];
      }
      assertEquals(plain, Retriever.dot(a, b), 1e-12, "length " + n);
    }
    float[] unit = new float[384];
    java.util.Arrays.fill(unit, (float) (1 / Math.sqrt(384)));
    assertEquals(1.0, Retriever.dot(unit, unit), 1e-6, "a unit vector with itself");
  }
}
