package org.precedent.api.triage;

import java.io.IOException;
import java.io.StringReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import java.util.Properties;
import org.precedent.knowledge.io.AtomicFiles;

/**
 * How far a triage run got: tickets whose decisions are in the output file, and the output's length
 * just after the last of them. Written atomically after the output is forced to disk, so on resume
 * anything past that length is a torn or uncommitted tail and is cut off.
 *
 * @param tickets tickets done
 * @param bytes   length of the output holding exactly their lines
 * @param input   the input file's size when the run started, to notice a changed input
 */
record TriageProgress(long tickets, long bytes, long input) {
  static Path fileFor(Path out) {
    return out.resolveSibling(out.getFileName() + ".progress");
  }

  static Optional<TriageProgress> read(Path out) throws IOException {
    Path file = fileFor(out);
    if (!Files.exists(file)) {
      return Optional.empty();
    }
    Properties p = new Properties();
    p.load(new StringReader(Files.readString(file)));
    try {
      return Optional.of(new TriageProgress(Long.parseLong(p.getProperty("tickets")),
          Long.parseLong(p.getProperty("bytes")), Long.parseLong(p.getProperty("input"))));
    } catch (RuntimeException e) {
      throw new IOException(file + ": not a triage progress file (" + e.getMessage() + ")");
    }
  }

  void write(Path out) throws IOException {
    AtomicFiles.writeString(fileFor(out), "# triage progress: do not edit\ntickets=" + tickets
        + "\nbytes=" + bytes + "\ninput=" + input + "\n");
  }
}
