package org.precedent.knowledge.io;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.channels.FileChannel;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.PosixFilePermission;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.List;
import java.util.Set;

/**
 * Writes files so that a crash at any moment leaves either the old file or the new one, never a
 * torn one: write a temporary file beside the target, force it to disk, then rename over the target.
 * The files it writes and the directories it makes are private to their owner (600 and 700): the
 * data directory holds customers' questions and the audit.
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
    createPrivateDirectories(dir);
    // A temporary file is created owner-only (600 where permissions exist), and stays so.
    Path temp = Files.createTempFile(dir, "." + target.getFileName() + ".", ".tmp");
    try {
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

  /** Creates {@code dir} and its missing parents owner-only (700). */
  public static void createPrivateDirectories(Path dir) throws IOException {
    if (Files.isDirectory(dir)) {
      return;
    }
    if (posix(dir)) {
      Files.createDirectories(dir, PosixFilePermissions.asFileAttribute(OWNER_DIR));
    } else {
      Files.createDirectories(dir);
    }
  }

  /**
   * Makes {@code tree} (a file, or a directory and everything in it) private to its owner:
   * no access for group or others (700 and 600 for what its owner may read and write; what the
   * owner made read-only stays read-only). On a file system without POSIX permissions, or where
   * they cannot be changed, it says so once on standard error and carries on.
   */
  public static void makePrivate(Path tree) throws IOException {
    if (!Files.exists(tree)) {
      return;
    }
    if (!posix(tree)) {
      warnOnce(tree, "its file system has no POSIX permissions");
      return;
    }
    List<Path> all;
    try (java.util.stream.Stream<Path> walk = Files.walk(tree)) {
      all = walk.toList();
    }
    for (Path p : all) {
      try {
        if (!Files.isSymbolicLink(p)) {
          // Only group and other access is taken away: a file its owner made read-only stays so.
          Set<PosixFilePermission> now = Files.getPosixFilePermissions(p, LinkOption.NOFOLLOW_LINKS);
          Set<PosixFilePermission> wanted = java.util.EnumSet.noneOf(PosixFilePermission.class);
          wanted.addAll(now);
          wanted.retainAll(OWNER_DIR);
          if (!wanted.equals(now)) {
            Files.setPosixFilePermissions(p, wanted);
          }
        }
      } catch (java.nio.file.NoSuchFileException gone) {
        // removed meanwhile (a temporary file)
      } catch (java.nio.file.FileSystemException e) {
        warnOnce(tree, "the permissions of " + p + " cannot be changed (" + e.getReason() + ")");
        return;
      }
    }
  }

  private static final Set<PosixFilePermission> OWNER_DIR =
      PosixFilePermissions.fromString("rwx------");
  private static final Set<Path> WARNED = java.util.concurrent.ConcurrentHashMap.newKeySet();

  private static boolean posix(Path p) throws IOException {
    Path existing = p.toAbsolutePath();
    while (existing != null && !Files.exists(existing)) {
      existing = existing.getParent();
    }
    return existing == null || Files.getFileStore(existing).supportsFileAttributeView("posix");
  }

  private static void warnOnce(Path tree, String why) {
    if (WARNED.add(tree.toAbsolutePath())) {
      System.err.println("precedent: warning: " + tree + " cannot be made private to its owner: "
          + why);
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
