package org.precedent.api.models;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.precedent.api.testing.TrainedData;

/** Model versions made for tests from the trained one. */
final class TestCopies {
  private TestCopies() {}

  /** A copy of v-0001 whose weights file is cut short, so its checksum no longer matches. */
  static void damagedVersion(Path data, String name) throws IOException {
    Path dir = data.resolve("models").resolve(name);
    TrainedData.copyTree(data.resolve("models/v-0001"), dir);
    Path weights = dir.resolve("model.zip");
    byte[] bytes = Files.readAllBytes(weights);
    Files.write(weights, java.util.Arrays.copyOf(bytes, bytes.length / 2));
  }
}
