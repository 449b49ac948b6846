package org.precedent.knowledge.store;

import org.precedent.knowledge.io.AtomicFiles;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.ingest.ColumnMapping;
import org.precedent.knowledge.ingest.ExportFormat;
import org.precedent.knowledge.ingest.Ingestor;
import org.precedent.knowledge.io.Progress;

/** The data directory holds customers' questions: after an ingest only its owner can read it. */
class PrivateDataTest {
  @TempDir
  Path tmp;

  @BeforeEach
  void posixOnly() throws IOException {
    Assumptions.assumeTrue(Files.getFileStore(tmp).supportsFileAttributeView("posix"),
        "the file system of " + tmp + " has no POSIX permissions");
  }

  private void ingest(DataDir data) throws Exception {
    Path csv = tmp.resolve("tickets.csv");
    Files.writeString(csv, "id,question,reply\nT-1,my bin was not emptied,A crew will come back."
        + "\nT-2,how do I send a meter reading,Online at any time.\n", StandardCharsets.UTF_8);
    new Ingestor(data, TextCleaner.standard(), AnswerGrouper.standard()).ingest(csv,
        ExportFormat.CSV, ColumnMapping.of(Map.of("id", "id", "question", "question", "reply",
            "reply")), Progress.silent(), Progress.silent());
  }

  /** Every path under {@code root} whose group or others may read, write or enter it. */
  private static List<String> open(Path root) throws IOException {
    try (Stream<Path> walk = Files.walk(root)) {
      return walk.map(p -> root.relativize(p) + " " + mode(p))
          .filter(s -> !s.endsWith("------")).toList();
    }
  }

  private static String mode(Path p) {
    try {
      return PosixFilePermissions.toString(Files.getPosixFilePermissions(p));
    } catch (IOException e) {
      throw new java.io.UncheckedIOException(e);
    }
  }

  @Test
  void aNewDataDirectoryAndEveryFileInItAreTheOwnersAlone() throws Exception {
    DataDir data = new DataDir(tmp.resolve("new/data"));
    ingest(data);
    assertEquals("rwx------", mode(data.root()));
    Path generation = data.currentGeneration().orElseThrow();
    assertEquals("rw-------", mode(generation.resolve("tickets.jsonl")));
    assertTrue(Files.list(generation.resolve("index")).findAny().isPresent());
    assertEquals(List.of(), open(data.root()));
  }

  @Test
  void anExistingWorldReadableDataDirectoryIsMadePrivate() throws Exception {
    Path root = Files.createDirectories(tmp.resolve("old"));
    Files.setPosixFilePermissions(root, PosixFilePermissions.fromString("rwxr-xr-x"));
    Path rules = Files.writeString(root.resolve("safety.rules"), "# none\n");
    Files.setPosixFilePermissions(rules, PosixFilePermissions.fromString("rw-r--r--"));
    ingest(new DataDir(root));
    assertEquals(List.of(), open(root));
  }

  @Test
  void filesWrittenAtomicallyAreTheOwnersAlone() throws IOException {
    Path file = tmp.resolve("fresh/dir/file.txt");
    AtomicFiles.writeString(file, "x");
    assertEquals("rw-------", mode(file));
    assertEquals("rwx------", mode(file.getParent()));
    assertEquals("rwx------", mode(file.getParent().getParent()));
  }
}
