package org.precedent.api.models;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.precedent.api.testing.Http;
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

  /**
   * A copy of v-0001 whose fusion model was edited by hand so that every top candidate gets a
   * confidence of 1.0 (each system's Platt map made flat at its top), still valid JSON.
   */
  static void overconfidentVersion(Path data, String name) throws IOException {
    recalibrated(data, name, 0.0, -50.0);
  }

  /**
   * A copy of v-0001 with every system's Platt parameters set to {@code a} and {@code b} (the
   * confidence is 1 / (1 + exp(a f + b))), its manifest left as it was.
   */
  static Path recalibrated(Path data, String name, double a, double b) throws IOException {
    Path dir = data.resolve("models").resolve(name);
    TrainedData.copyTree(data.resolve("models/v-0001"), dir);
    Path fusion = dir.resolve("fusion.json");
    var json = Http.JSON.readTree(fusion.toFile());
    for (var system : json.get("systems")) {
      var calibration = (com.fasterxml.jackson.databind.node.ObjectNode) system.get("calibration");
      calibration.put("a", a);
      calibration.put("b", b);
    }
    Http.JSON.writeValue(fusion.toFile(), json);
    return dir;
  }

  /**
   * A copy of v-0001 as an earlier release left it: the manifest lists the reranker's files but
   * not fusion.json, which was written after the manifest.
   */
  static void earlierReleaseVersion(Path data, String name) throws IOException {
    Path dir = data.resolve("models").resolve(name);
    TrainedData.copyTree(data.resolve("models/v-0001"), dir);
    Path manifest = dir.resolve("manifest.properties");
    List<String> kept = Files.readAllLines(manifest).stream()
        .filter(line -> !line.startsWith("fusion.json")).toList();
    Files.write(manifest, kept);
  }
}
