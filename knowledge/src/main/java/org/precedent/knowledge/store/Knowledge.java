package org.precedent.knowledge.store;

import org.precedent.knowledge.io.AtomicFiles;

import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.datatype.jsr310.JavaTimeModule;
import java.io.BufferedReader;
import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStreamWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.precedent.knowledge.group.Grouping;
import org.precedent.knowledge.ticket.Ticket;

/**
 * One generation of stored knowledge: the cleaned tickets and their answer groups, and where the
 * generation's search index lies. The groups and the manifest are read at once; the tickets when
 * first asked for, since deciding needs only the index (and a service then holds no second copy
 * of every ticket, nor does a one-question command wait to read them).
 *
 * <p>Files of a generation: {@code tickets.jsonl} (one ticket a line), {@code groups.json},
 * {@code manifest.json}, and {@code index/}. A generation never changes once written. The store
 * decides where the index goes and when it is written (before the manifest, so a generation with a
 * manifest is complete); what goes in it is the retrieval package's business, handed in as an
 * {@link IndexBuilder} and opened from {@link #indexDirectory()}, so the store does not depend on it.
 */
public final class Knowledge {
  static final ObjectMapper JSON = new ObjectMapper()
      .registerModule(new JavaTimeModule())
      .disable(SerializationFeature.WRITE_DATES_AS_TIMESTAMPS)
      .disable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES);
  private static final String INDEX = "index";

  private final Path generation;
  private volatile Map<String, Ticket> tickets;
  private final Grouping grouping;
  private final Manifest manifest;

  /** Writes a generation's search index into an empty directory. */
  @FunctionalInterface
  public interface IndexBuilder {
    /** @return what made the question vectors the index holds, or null when it holds none */
    Manifest.Vectors build(Path indexDirectory, List<Ticket> tickets, Grouping grouping)
        throws IOException;
  }

  private Knowledge(Path generation, Grouping grouping, Manifest manifest) {
    this.generation = generation;
    this.grouping = grouping;
    this.manifest = manifest;
  }

  /** The knowledge in force in {@code dir}, or empty when nothing was ingested yet. */
  public static Optional<Knowledge> open(DataDir dir) throws IOException {
    Optional<Path> current = dir.currentGeneration();
    if (current.isEmpty()) {
      return Optional.empty();
    }
    Path generation = current.get();
    Path ticketsFile = generation.resolve("tickets.jsonl");
    if (!Files.isRegularFile(ticketsFile)) {
      throw new IOException(ticketsFile + ": missing from the generation in force");
    }
    Grouping grouping = JSON.readValue(generation.resolve("groups.json").toFile(), Grouping.class);
    Manifest manifest = JSON.readValue(generation.resolve("manifest.json").toFile(), Manifest.class);
    return Optional.of(new Knowledge(generation, grouping, manifest));
  }

  private static Map<String, Ticket> readTickets(Path file) throws IOException {
    Map<String, Ticket> tickets = new LinkedHashMap<>();
    try (BufferedReader in = Files.newBufferedReader(file)) {
      String line;
      int number = 0;
      while ((line = in.readLine()) != null) {
        number++;
        Ticket t;
        try {
          t = JSON.readValue(line, Ticket.class);
        } catch (IOException | RuntimeException e) {
          throw new IOException(file + ":" + number + ": not a stored ticket ("
              + String.valueOf(e.getMessage()).split("\n")[0] + ")", e);
        }
        tickets.put(t.id(), t);
      }
    }
    return Collections.unmodifiableMap(tickets);
  }

  /**
   * Writes a new generation holding exactly {@code tickets} and puts it in force. The caller holds
   * the data directory's lock. On any failure the unfinished generation is removed and the previous
   * one stays in force.
   *
   * @param index writes the search index of {@code tickets} into the generation's index directory
   */
  public static void replace(DataDir dir, List<Ticket> tickets, Grouping grouping,
      List<String> sources, IndexBuilder index) throws IOException {
    Path generation = dir.newGeneration();
    try {
      AtomicFiles.write(generation.resolve("tickets.jsonl"), out -> {
        BufferedWriter w = new BufferedWriter(new OutputStreamWriter(out, StandardCharsets.UTF_8));
        for (Ticket t : tickets) {
          w.write(JSON.writeValueAsString(t));
          w.write('\n');
        }
        w.flush();
      });
      AtomicFiles.write(generation.resolve("groups.json"), out -> JSON.writeValue(
          nonClosing(out), grouping));
      Path indexDirectory = generation.resolve(INDEX);
      Files.createDirectory(indexDirectory);
      Manifest.Vectors vectors = index.build(indexDirectory, tickets, grouping);
      Manifest manifest = new Manifest(java.time.Instant.now(), tickets.size(),
          grouping.groups().size(), grouping.oneOffs().size(), grouping.method(), sources, vectors);
      // The manifest is written last: a generation without one was never finished.
      AtomicFiles.write(generation.resolve("manifest.json"), out -> JSON.writerWithDefaultPrettyPrinter()
          .writeValue(nonClosing(out), manifest));
      dir.activate(generation);
    } catch (IOException | RuntimeException e) {
      DataDir.discard(generation);
      throw e;
    }
  }

  private static java.io.OutputStream nonClosing(java.io.OutputStream out) {
    return new java.io.FilterOutputStream(out) {
      @Override
      public void close() throws IOException {
        flush();
      }
    };
  }

  public Path generation() {
    return generation;
  }

  /** Tickets by id, in the order they were stored. */
  public Map<String, Ticket> tickets() {
    Map<String, Ticket> read = tickets;
    if (read == null) {
      synchronized (this) {
        if (tickets == null) {
          try {
            tickets = readTickets(generation.resolve("tickets.jsonl"));
          } catch (IOException e) {
            throw new java.io.UncheckedIOException(e.getMessage(), e);
          }
        }
        read = tickets;
      }
    }
    return read;
  }

  public Grouping grouping() {
    return grouping;
  }

  public Manifest manifest() {
    return manifest;
  }

  /** The directory of this generation's search index, as its {@link IndexBuilder} wrote it. */
  public Path indexDirectory() {
    return generation.resolve(INDEX);
  }
}
