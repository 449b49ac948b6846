package org.precedent.knowledge.store;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.channels.FileChannel;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;

/**
 * Writes files so that a crash at any moment leaves either the old file or the new one, never a
 * torn one: write a temporary file beside the target, force it to disk, then rename over the target.
 */
public final class AtomicFiles {
  private AtomicFiles() {}

  /** A writer of a file's content. */
  @FunctionalInterface
  public interface Content {
    void writeTo(OutputStream out) throws IOException;
  }

  /** Something that writes a whole file at a path, for libraries that only take a path. */
  @FunctionalInterface
  public interface PathWriter {
    void write(Path file) throws IOException;
  }

  public static void write(Path target, Content content) throws IOException {
    writeVia(target, temp -> {
      try (OutputStream out = Files.newOutputStream(temp)) {
        content.writeTo(out);
      }
    });
  }

  /** Lets {@code writer} fill a temporary file beside the target, syncs it, renames it over. */
  public static void writeVia(Path target, PathWriter writer) throws IOException {
    Path dir = target.toAbsolutePath().getParent();
    Files.createDirectories(dir);
    Path temp = Files.createTempFile(dir, "." + target.getFileName() + ".", ".tmp");
    try {
      // Temporary files are created owner-only; the result is an ordinary file like any other.
      setOrdinaryPermissions(temp);
      writer.write(temp);
      sync(temp);
      move(temp, target);
    } finally {
      Files.deleteIfExists(temp);
    }
  }

  /** Forces a file's content to disk. */
  public static void sync(Path file) throws IOException {
    try (FileChannel channel = FileChannel.open(file, StandardOpenOption.WRITE)) {
      channel.force(true);
    }
  }

  /** The SHA-256 of a file's bytes, in lower-case hex. */
  public static String sha256(Path file) throws IOException {
    java.security.MessageDigest digest = sha256();
    try (var in = Files.newInputStream(file)) {
      byte[] buffer = new byte[1 << 16];
      int n;
      while ((n = in.read(buffer)) > 0) {
        digest.update(buffer, 0, n);
      }
    }
    return java.util.HexFormat.of().formatHex(digest.digest());
  }

  public static java.security.MessageDigest sha256() {
    try {
      return java.security.MessageDigest.getInstance("SHA-256");
    } catch (java.security.NoSuchAlgorithmException e) {
      throw new IllegalStateException("every Java runtime has SHA-256", e);
    }
  }

  private static void setOrdinaryPermissions(Path file) {
    try {
      Files.setPosixFilePermissions(file,
          java.nio.file.attribute.PosixFilePermissions.fromString("rw-r--r--"));
    } catch (UnsupportedOperationException | IOException e) {
      // Not a POSIX file system: keep its default.
    }
  }

  /** Removes a directory and everything in it; nothing happens when it is absent. */
  public static void deleteTree(Path dir) throws IOException {
    if (!Files.exists(dir)) {
      return;
    }
    try (java.util.stream.Stream<Path> walk = Files.walk(dir)) {
      for (Path p : walk.sorted(java.util.Comparator.reverseOrder()).toList()) {
        Files.deleteIfExists(p);
      }
    }
  }

  public static void writeString(Path target, String text) throws IOException {
    write(target, out -> out.write(text.getBytes(java.nio.charset.StandardCharsets.UTF_8)));
  }

  /**
   * Renames {@code from} (a file, or a directory onto an absent one) onto {@code to} atomically,
   * then forces the directory entry to disk. A file system without atomic rename is an error, not a
   * silent copy.
   */
  public static void move(Path from, Path to) throws IOException {
    try {
      Files.move(from, to, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
    } catch (AtomicMoveNotSupportedException e) {
      throw new IOException("the file system of " + to + " cannot rename atomically", e);
    }
    syncDirectory(to.toAbsolutePath().getParent());
  }

  static void syncDirectory(Path dir) {
    try (FileChannel channel = FileChannel.open(dir, StandardOpenOption.READ)) {
      channel.force(true);
    } catch (IOException e) {
      // Some file systems cannot open a directory for syncing; the rename itself is still atomic.
    }
  }
}
