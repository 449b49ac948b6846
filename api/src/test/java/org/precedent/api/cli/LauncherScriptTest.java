package org.precedent.api.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.List;
import java.util.Map;
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

  /**
   * The memory each command gets. Measured on the demo model (DEVELOPERS.md, "The service"): with
   * the 4 GB heap that training needs, a service under 20 clients kept growing on garbage (heap to
   * 1.8 GB, the process to 1.5 GB over three 60 s runs, 1.9 GB in the review); with the service's
   * own ceilings it stays under them. Java is replaced by a stand-in that writes down its
   * arguments.
   */
  @Test
  void theServiceRunsWithItsOwnMemoryCeilingsAndTrainingWithMore() throws Exception {
    Path home = Files.createDirectories(tmp.resolve("checkout"));
    Files.copy(TrainedData.root().resolve("precedent"), home.resolve("precedent"));
    // A jar newer than any source: the script starts it without building.
    Files.createDirectories(home.resolve("api/target"));
    Files.writeString(home.resolve("api/target/precedent.jar"), "");
    Path bin = Files.createDirectories(tmp.resolve("bin"));
    Path java = bin.resolve("java");
    Files.writeString(java, "#!/bin/sh\nprintf '%s\\n' \"$@\" > \"$ARGS_OUT\"\n");
    Files.setPosixFilePermissions(java, PosixFilePermissions.fromString("rwxr-xr-x"));

    List<String> serve = javaArguments(home, bin, null, "--data", "some dir", "serve", "--port",
        "9");
    assertTrue(serve.contains("-Xmx1g"), serve.toString());
    assertTrue(serve.contains("-XX:MaxDirectMemorySize=128m"), serve.toString());
    assertTrue(serve.contains("-Dorg.bytedeco.javacpp.maxphysicalbytes=1536m"), serve.toString());
    assertEquals(List.of("--data", "some dir", "serve", "--port", "9"),
        serve.subList(serve.indexOf("-jar") + 2, serve.size()));

    // The demo trains beside the service it starts: the service's heap.
    List<String> demo = javaArguments(home, bin, null, "demo", "--no-serve");
    assertTrue(demo.contains("-Xmx1g"), demo.toString());
    assertTrue(demo.contains("-XX:MaxDirectMemorySize=128m"), demo.toString());
    assertTrue(demo.contains("-Dorg.bytedeco.javacpp.maxphysicalbytes=1536m"), demo.toString());
    for (List<String> args : List.of(List.of("train"),
        List.of("--data=x", "benchmark", "service"))) {
      List<String> other = javaArguments(home, bin, null, args.toArray(String[]::new));
      assertTrue(other.contains("-Xmx4g"), args + ": " + other);
      assertFalse(other.stream().anyMatch(a -> a.contains("maxphysicalbytes")), other.toString());
    }
    // The user's own settings replace the defaults, for the service too.
    List<String> own = javaArguments(home, bin, "-Xmx3g", "serve");
    assertEquals("-Xmx3g", own.get(0), own.toString());
    assertFalse(own.contains("-Xmx1g"), own.toString());
  }

  private List<String> javaArguments(Path home, Path bin, String javaOpts, String... args)
      throws Exception {
    Path out = Files.createTempFile(tmp, "args", ".txt");
    List<String> command = new java.util.ArrayList<>(List.of("bash",
        home.resolve("precedent").toString()));
    command.addAll(List.of(args));
    ProcessBuilder b = new ProcessBuilder(command).redirectErrorStream(true)
        .redirectOutput(tmp.resolve("launcher.log").toFile());
    Map<String, String> env = b.environment();
    env.put("PATH", bin + java.io.File.pathSeparator + env.get("PATH"));
    env.put("ARGS_OUT", out.toString());
    env.remove("PRECEDENT_JAVA_OPTS");
    if (javaOpts != null) {
      env.put("PRECEDENT_JAVA_OPTS", javaOpts);
    }
    Process p = b.start();
    assertTrue(p.waitFor(1, TimeUnit.MINUTES), "the script did not end");
    assertEquals(0, p.exitValue(), Files.readString(tmp.resolve("launcher.log")));
    return Files.readAllLines(out, StandardCharsets.UTF_8);
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
