package org.precedent.knowledge.store;

import org.precedent.knowledge.io.AtomicFiles;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.channels.OverlappingFileLockException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.List;
import java.util.Optional;
import java.util.stream.Stream;

/**
 * The one directory where Precedent keeps its state.
 *
 * <p>Knowledge (tickets, answer groups, the index) lives in numbered generations,
 * {@code knowledge/gen-000001}, ...; the file {@code knowledge/CURRENT} names the one in force. A
 * change builds a complete new generation, then replaces CURRENT atomically, so a crash at any
 * moment leaves the previous generation serving. Model versions live under {@code models/}; beside
 * them the team's settings ({@code own-details.txt}, {@code safety.rules},
 * {@code thresholds.properties}, {@code slot-fields.properties}), evaluation reports ({@code reports/}) and the service's own files.
 * Every name in the directory is given here, so that no other class knows the layout.
 *
 * <p>The directory holds customers' questions and the audit, so it is kept private to its owner:
 * it is made so when a change or the service opens it, and new files are made so as they are
 * written ({@link AtomicFiles}).
 */
public final class DataDir {
  private static final String GENERATION_PREFIX = "gen-";

  private final Path root;

  public DataDir(Path root) {
    this.root = root.toAbsolutePath().normalize();
  }

  public Path root() {
    return root;
  }

  public Path knowledge() {
    return root.resolve("knowledge");
  }

  /** The organisation's own contact details, which redaction keeps ({@code OwnDetails}). */
  public Path ownDetails() {
    return root.resolve("own-details.txt");
  }

  public Path models() {
    return root.resolve("models");
  }

  /** The team's safety rules; without the file the built-in rules apply. */
  public Path safetyRules() {
    return root.resolve("safety.rules");
  }

  /**
   * Which field of an incoming ticket fills which slot of an answer ({@code
   * engine.decide.SlotFields}); without the file every answer with slots goes to a person.
   */
  public Path slotFields() {
    return root.resolve("slot-fields.properties");
  }

  /** The thresholds in force; without the file the default threshold applies. */
  public Path thresholds() {
    return root.resolve("thresholds.properties");
  }

  /** Evaluation reports, each stamped with its time, and {@link #latestReport()}. */
  public Path reports() {
    return root.resolve("reports");
  }

  /**
   * The service's database, without H2's file ending ({@code .mv.db}); the service's settings
   * ({@code precedent.service.dir}) name the same place by default.
   */
  public Path serviceDatabase() {
    return root.resolve("service").resolve("precedent");
  }

  /** The last evaluation's JSON report, which the manager's page reads. */
  public Path latestReport() {
    return reports().resolve("latest.json");
  }

  /** The generation in force, if any knowledge was ever stored. */
  public Optional<Path> currentGeneration() throws IOException {
    try {
      String name = Files.readString(knowledge().resolve("CURRENT"), StandardCharsets.UTF_8).strip();
      Path generation = knowledge().resolve(name);
      if (!name.startsWith(GENERATION_PREFIX) || !Files.isDirectory(generation)) {
        throw new IOException(knowledge().resolve("CURRENT") + ": names '" + name
            + "', which is not a generation directory");
      }
      return Optional.of(generation);
    } catch (NoSuchFileException e) {
      return Optional.empty();
    }
  }

  /**
   * Creates the directory if it is missing and makes it and everything in it private to its owner
   * (directories 700, files 600); on file systems without POSIX permissions it warns and goes on.
   */
  public void makePrivate() throws IOException {
    AtomicFiles.createPrivateDirectories(root);
    AtomicFiles.makePrivate(root);
  }

  /** A fresh, empty directory for the next generation; it is not in force until activated. */
  Path newGeneration() throws IOException {
    AtomicFiles.createPrivateDirectories(knowledge());
    int next = generations().stream().mapToInt(DataDir::number).max().orElse(0) + 1;
    Path dir = knowledge().resolve(String.format("%s%06d", GENERATION_PREFIX, next));
    Files.createDirectory(dir);
    return dir;
  }

  /** Puts {@code generation} in force, then removes generations older than the one it replaces. */
  void activate(Path generation) throws IOException {
    // Its index files come from Lucene, with the process's default permissions.
    AtomicFiles.makePrivate(generation);
    Optional<Path> previous = currentGeneration();
    AtomicFiles.writeString(knowledge().resolve("CURRENT"), generation.getFileName() + "\n");
    for (Path old : generations()) {
      boolean keep = old.equals(generation) || previous.map(old::equals).orElse(false);
      if (!keep) {
        AtomicFiles.deleteTree(old);
      }
    }
  }

  /** Removes an unfinished generation left by a failed or interrupted change. */
  static void discard(Path generation) {
    try {
      AtomicFiles.deleteTree(generation);
    } catch (IOException e) {
      // Left for the next activation to remove.
    }
  }

  /**
   * Takes the data directory's write lock, so that two changes cannot interleave. Readers need no
   * lock: they read whichever generation CURRENT named when they opened it.
   */
  public FileLock lock() throws IOException {
    AtomicFiles.createPrivateDirectories(root);
    FileChannel channel = FileChannel.open(root.resolve(".lock"), StandardOpenOption.CREATE,
        StandardOpenOption.WRITE);
    try {
      FileLock lock = channel.tryLock();
      if (lock == null) {
        channel.close();
        throw new IOException(root + ": another Precedent process is changing this data directory");
      }
      try {
        makePrivate();
      } catch (IOException | RuntimeException e) {
        channel.close();
        throw e;
      }
      return lock;
    } catch (OverlappingFileLockException e) {
      channel.close();
      throw new IOException(root + ": this process already holds the data directory's lock", e);
    }
  }

  private List<Path> generations() throws IOException {
    if (!Files.isDirectory(knowledge())) {
      return List.of();
    }
    try (Stream<Path> list = Files.list(knowledge())) {
      return list.filter(p -> p.getFileName().toString().matches(GENERATION_PREFIX + "\\d+"))
          .toList();
    }
  }

  private static int number(Path generation) {
    return Integer.parseInt(generation.getFileName().toString().substring(GENERATION_PREFIX.length()));
  }
}
