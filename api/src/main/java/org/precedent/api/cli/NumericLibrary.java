package org.precedent.api.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.stream.Stream;

/**
 * Says, once per run, that the numeric library (ND4J's native CPU backend) is loading: its first
 * load unpacks about 400 MB of native code, which takes seconds with nothing else on screen.
 */
final class NumericLibrary {
  private static final AtomicBoolean SAID = new AtomicBoolean();

  private NumericLibrary() {}

  /** Prints the notice on {@code err}, unless this run has printed it already. */
  static void announce(PrintWriter err) {
    if (!SAID.compareAndSet(false, true)) {
      return;
    }
    Path cache = cacheDir();
    // Measured on this project's 2-core machine under load: about 12 s the first time, 5 s after.
    err.println(unpacked(cache)
        ? "precedent: loading the numeric library (a few seconds)..."
        : "precedent: loading the numeric library; this first run unpacks it into " + cache
            + " (about 15 s, once)...");
    err.flush();
  }

  /**
   * Where JavaCPP, which loads ND4J's native code, unpacks it: the system property
   * {@code org.bytedeco.javacpp.cachedir}, else {@code ~/.javacpp/cache}.
   */
  static Path cacheDir() {
    String set = System.getProperty("org.bytedeco.javacpp.cachedir",
        System.getProperty("org.bytedeco.javacpp.cacheDir"));
    return set != null && !set.isBlank() ? Path.of(set)
        : Path.of(System.getProperty("user.home"), ".javacpp", "cache");
  }

  private static boolean unpacked(Path cache) {
    if (!Files.isDirectory(cache)) {
      return false;
    }
    try (Stream<Path> entries = Files.list(cache)) {
      return entries.anyMatch(p -> p.getFileName().toString().startsWith("nd4j-native"));
    } catch (IOException e) {
      return false;
    }
  }
}
