package org.precedent.engine.rerank.io;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/**
 * Writes files so that a crash at any moment leaves either the old content or the new, never a mix:
 * the bytes go to a temporary file in the same directory, are forced to disk, then renamed over the target.
 */
public final class AtomicFiles {

  /** Something that writes a whole file to a stream. */
  @FunctionalInterface
  public interface StreamWriter {
    void write(OutputStream out) throws IOException;
  }

  /** Something that writes a whole file at a path (for libraries that only take a path). */
  @FunctionalInterface
  public interface PathWriter {
    void write(Path file) throws IOException;
  }

  private AtomicFiles() {}

  public static void writeString(Path target, String content) throws IOException {
    write(target, out -> out.write(content.getBytes(StandardCharsets.UTF_8)));
  }

  public static void write(Path target, StreamWriter writer) throws IOException {
    writeVia(target, tmp -> {
      try (OutputStream out = Files.newOutputStream(tmp)) {
        writer.write(out);
      }
    });
  }

  /** Lets {@code writer} fill a temporary file, syncs it, then renames it onto {@code target}. */
  public static void writeVia(Path target, PathWriter writer) throws IOException {
    Path dir = target.toAbsolutePath().getParent();
    Files.createDirectories(dir);
    Path tmp = Files.createTempFile(dir, "." + target.getFileName() + ".", ".tmp");
    try {
      writer.write(tmp);
      sync(tmp);
      moveAtomically(tmp, target);
    } finally {
      Files.deleteIfExists(tmp);
    }
  }

  /** Renames with ATOMIC_MOVE; a file system without atomic rename is an error, not a silent copy. */
  public static void moveAtomically(Path from, Path to) throws IOException {
    try {
      Files.move(from, to, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
    } catch (AtomicMoveNotSupportedException e) {
      throw new IOException("the file system under " + to.getParent() + " cannot rename atomically", e);
    }
  }

  public static String sha256(Path file) throws IOException {
    MessageDigest digest = sha256();
    try (var in = Files.newInputStream(file)) {
      byte[] buffer = new byte[1 << 16];
      int n;
      while ((n = in.read(buffer)) > 0) {
        digest.update(buffer, 0, n);
      }
    }
    return HexFormat.of().formatHex(digest.digest());
  }

  public static MessageDigest sha256() {
    try {
      return MessageDigest.getInstance("SHA-256");
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("every Java runtime has SHA-256", e);
    }
  }

  /** Forces a file's content to disk. */
  public static void sync(Path file) throws IOException {
    try (var channel = java.nio.channels.FileChannel.open(file, java.nio.file.StandardOpenOption.WRITE)) {
      channel.force(true);
    }
  }
}
