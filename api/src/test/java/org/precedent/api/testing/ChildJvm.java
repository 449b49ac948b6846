package org.precedent.api.testing;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/** The precedent command line in a JVM of its own, so that a test can kill it with SIGKILL. */
public final class ChildJvm implements AutoCloseable {
  private final Process process;
  private final Path log;

  private ChildJvm(Process process, Path log) {
    this.process = process;
    this.log = log;
  }

  /** Starts {@code precedent ARGS...} on the test class path; output goes to a log file. */
  public static ChildJvm start(Path log, String... args) throws IOException {
    return start(log, List.of(), args);
  }

  /** As {@link #start(Path, String...)}, with options for the JVM (such as -Dname=value). */
  public static ChildJvm start(Path log, List<String> jvmOptions, String... args)
      throws IOException {
    List<String> command = new ArrayList<>();
    command.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
    command.add("-Xmx1g");
    command.addAll(jvmOptions);
    command.add("-cp");
    command.add(System.getProperty("java.class.path"));
    command.add("org.precedent.api.cli.PrecedentCommand");
    command.addAll(List.of(args));
    ProcessBuilder b = new ProcessBuilder(command).redirectErrorStream(true)
        .redirectOutput(log.toFile());
    b.environment().put("OMP_NUM_THREADS", "1");
    return new ChildJvm(b.start(), log);
  }

  /** Waits until the log has a line matching {@code pattern}; returns its first group. */
  public String await(Pattern pattern, Duration timeout) throws Exception {
    long end = System.nanoTime() + timeout.toNanos();
    while (System.nanoTime() < end) {
      Matcher m = pattern.matcher(Files.readString(log));
      if (m.find()) {
        return m.groupCount() > 0 ? m.group(1) : m.group();
      }
      if (!process.isAlive()) {
        throw new AssertionError("the child JVM ended (" + process.exitValue() + "):\n" + tail());
      }
      Thread.sleep(100);
    }
    throw new AssertionError("no line matching " + pattern + " within " + timeout + ":\n" + tail());
  }

  /** SIGKILL: no shutdown hook runs, nothing is flushed. */
  public void kill() throws InterruptedException {
    process.destroyForcibly();
    process.waitFor();
  }

  /** SIGTERM, then waits for the JVM to end. */
  public int stop() throws InterruptedException {
    process.destroy();
    return process.waitFor();
  }

  public int waitFor() throws InterruptedException {
    return process.waitFor();
  }

  public String tail() throws IOException {
    String s = Files.readString(log);
    return s.length() <= 4000 ? s : s.substring(s.length() - 4000);
  }

  @Override
  public void close() throws InterruptedException {
    if (process.isAlive()) {
      kill();
    }
  }
}
