package org.precedent.api.testing;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.precedent.engine.learn.TeamModelTrainer;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.ingest.ColumnMapping;
import org.precedent.knowledge.ingest.ExportFormat;
import org.precedent.knowledge.ingest.Ingestor;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;
import org.precedent.knowledge.ticket.Ticket;

/**
 * A small trained data directory, built once per test run and shared by the test classes: 600
 * demo tickets ingested and a tiny reranker trained on them (the demo's safety rules in force).
 * Each test gets its own copy, so tests never see each other's queue, thresholds or versions.
 */
public final class TrainedData {
  public static final int TICKETS = 600;
  private static Path built;

  private TrainedData() {}

  /** The repository root (set by the build as {@code precedent.root}). */
  public static Path root() {
    String root = System.getProperty("precedent.root");
    return root != null ? Path.of(root) : Path.of("..").toAbsolutePath().normalize();
  }

  /** A fresh copy of the trained data directory. */
  public static synchronized Path copy() {
    try {
      if (built == null) {
        built = build();
        Path done = built;
        Runtime.getRuntime().addShutdownHook(new Thread(() -> delete(done)));
      }
      Path target = Files.createTempDirectory("precedent-test-data-");
      copyTree(built, target);
      return target;
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** A question that overflows the stack of whoever checks it against {@link #copyWithOverflowingRule}'s rule. */
  public static final String OVERFLOWING_QUESTION = "my bin was not emptied " + "a'".repeat(5000);

  /**
   * A copy whose safety policy holds a rule a help desk could well write, a repeated group, which
   * java.util.regex matches by recursing once per repetition: {@link #OVERFLOWING_QUESTION}
   * overflows the stack of any thread that checks it, a real fault of a decision.
   */
  public static Path copyWithOverflowingRule() {
    Path data = copy();
    try {
      Files.writeString(data.resolve("safety.rules"), "\nrule apostrophe-words | health | "
          + "(?:[a-z]+')+x\n", StandardCharsets.UTF_8, StandardOpenOption.APPEND);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return data;
  }

  private static Path build() throws IOException {
    try {
      return buildOnce();
    } catch (org.precedent.knowledge.ingest.IngestException e) {
      throw new IOException(e.getMessage(), e);
    }
  }

  private static Path buildOnce() throws IOException, org.precedent.knowledge.ingest.IngestException {
    Path dir = Files.createTempDirectory("precedent-trained-");
    Path demo = root().resolve("demo-data");
    DataDir data = new DataDir(dir);
    ColumnMapping mapping = ColumnMapping.fromFile(demo.resolve("mapping.properties"), Map.of());
    Ingestor ingestor = new Ingestor(data, TextCleaner.standard(), AnswerGrouper.standard());
    Ingestor.ParsedExport all = ingestor.parse(demo.resolve("tickets.csv"), ExportFormat.CSV,
        mapping, Progress.silent());
    List<Ticket> some = all.tickets().subList(0, TICKETS);
    ingestor.store(new Ingestor.ParsedExport(all.file(), TICKETS, 0, some, List.of(), List.of()),
        Progress.silent());
    Files.copy(demo.resolve("safety.rules"), dir.resolve("safety.rules"));
    RerankerConfig tiny = RerankerConfig.defaults().withSizes(32, 64).withEpochs(2, 1)
        .withMaxTokens(32, 24);
    long start = System.nanoTime();
    Knowledge knowledge = Knowledge.open(data).orElseThrow();
    new TeamModelTrainer(data, tiny).train(knowledge, false);
    System.err.printf("test data: %d tickets ingested and a tiny model trained in %.1f s%n",
        TICKETS, (System.nanoTime() - start) / 1e9);
    // A second version, identical but for its name, to switch between.
    copyTree(data.models().resolve("v-0001"), data.models().resolve("v-0002"));
    return dir;
  }

  public static void copyTree(Path from, Path to) throws IOException {
    try (Stream<Path> paths = Files.walk(from)) {
      for (Path p : paths.toList()) {
        Path target = to.resolve(from.relativize(p).toString());
        if (Files.isDirectory(p)) {
          Files.createDirectories(target);
        } else {
          Files.copy(p, target);
        }
      }
    }
  }

  public static void delete(Path dir) {
    if (dir == null || !Files.exists(dir)) {
      return;
    }
    try {
      org.precedent.knowledge.io.AtomicFiles.deleteTree(dir);
    } catch (IOException e) {
      // A temp directory left behind is harmless; the test result is what matters.
    }
  }
}
