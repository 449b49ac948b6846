package org.precedent.api.models;

import java.nio.file.Path;

/** The model-version fixtures of {@link ModelComparisonTest}, for tests of other packages. */
public final class VersionFixtures {
  private VersionFixtures() {}

  /** The header and the first {@code n} records of a CSV export. */
  public static void firstRows(Path from, Path to, int n) throws Exception {
    ModelComparisonTest.firstRows(from, to, n);
  }

  /** A manifest for the files a version directory holds now, as the store makes one. */
  public static void remanifest(Path dir) throws Exception {
    java.util.Map<String, String> sums = new java.util.TreeMap<>();
    try (var files = java.nio.file.Files.list(dir)) {
      for (Path f : files.toList()) {
        if (java.nio.file.Files.isRegularFile(f)
            && !f.getFileName().toString().equals("manifest.properties")) {
          sums.put(f.getFileName().toString(), org.precedent.knowledge.io.AtomicFiles.sha256(f));
        }
      }
    }
    StringBuilder manifest = new StringBuilder();
    sums.forEach((file, sum) -> manifest.append(file).append('=').append(sum).append('\n'));
    java.nio.file.Files.writeString(dir.resolve("manifest.properties"), manifest);
  }

  /** A copy of v-0001 with every calibration flat at 0.5, a valid and worse version. */
  public static void flatVersion(Path data, String name) throws Exception {
    ModelComparisonTest.flatVersion(data, name);
  }
}
