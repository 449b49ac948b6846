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

  public static void write(Path target, Content content) throws IOException {
    Path dir = target.toAbsolutePath().getParent();
    Files.createDirectories(dir);
    Path temp = Files.createTempFile(dir, "." + target.getFileName() + ".", ".tmp");
    try {
      // Temporary files are created owner-only; the result is an ordinary file like any other.
      setOrdinaryPermissions(temp);
      try (FileChannel channel = FileChannel.open(temp, StandardOpenOption.WRITE);
          OutputStream out = java.nio.channels.Channels.newOutputStream(channel)) {
        content.writeTo(out);
        out.flush();
        channel.force(true);
      }
      move(temp, target);
    } finally {
      Files.deleteIfExists(temp);
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

  public static void writeString(Path target, String text) throws IOException {
    write(target, out -> out.write(text.getBytes(java.nio.charset.StandardCharsets.UTF_8)));
  }

  /** Renames {@code from} onto {@code to} atomically, then forces the directory entry to disk. */
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
