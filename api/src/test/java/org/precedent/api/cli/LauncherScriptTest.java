package org.precedent.api.cli;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.api.testing.TrainedData;

/** The {@code precedent} script at the top of the checkout, as a user first runs it. */
class LauncherScriptTest {
  @TempDir
  Path tmp;

  /**
   * The script's build step, run on a checkout with nothing to compile (a pom with no modules):
   * what it prints is Maven's own output, which must not leave terminal control codes behind.
   */
  @Test
  void theFirstBuildPrintsNoColourCodes() throws Exception {
    assumeTrue(onPath("mvn"), "Maven is not installed here");
    Path home = Files.createDirectories(tmp.resolve("checkout"));
    Files.copy(TrainedData.root().resolve("precedent"), home.resolve("precedent"));
    Files.writeString(home.resolve("pom.xml"), """
        <project xmlns="http://maven.apache.org/POM/4.0.0">
          <modelVersion>4.0.0</modelVersion>
          <groupId>org.precedent.test</groupId>
          <artifactId>empty</artifactId>
          <version>1</version>
          <packaging>pom</packaging>
        </project>
        """);
    Path log = tmp.resolve("launcher.log");
    ProcessBuilder b = new ProcessBuilder("bash", home.resolve("precedent").toString(), "--help")
        .redirectErrorStream(true).redirectOutput(log.toFile());
    b.environment().remove("MAVEN_OPTS");
    Process p = b.start();
    assertTrue(p.waitFor(5, TimeUnit.MINUTES), "the build did not end");
    String out = Files.readString(log, StandardCharsets.UTF_8);
    assertTrue(out.contains("precedent: building"), out);
    assertFalse(out.contains("\u001b"), "terminal control codes in: "
        + out.replace("\u001b", "ESC"));
  }

  private static boolean onPath(String program) {
    String path = System.getenv("PATH");
    if (path == null) {
      return false;
    }
    for (String dir : path.split(java.io.File.pathSeparator)) {
      if (Files.isExecutable(Path.of(dir, program))) {
        return true;
      }
    }
    return false;
  }
}
