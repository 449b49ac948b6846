package org.precedent.knowledge.ingest;

import java.io.IOException;
import java.nio.channels.FileLock;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.group.AnswerGroup;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.group.Grouping;
import org.precedent.knowledge.progress.Progress;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;
import org.precedent.knowledge.ticket.Ticket;

/**
 * Ingests an export of resolved tickets: read, validate, clean, merge with what is stored (same id
 * replaces), regroup, re-index, and put the new knowledge in force in one atomic step.
 *
 * <p>A bad row is reported and skipped; a bad file (missing, empty, not UTF-8 text, lacking a mapped
 * column) stops the ingest before anything changes.
 */
public final class Ingestor {
  private final DataDir dataDir;
  private final TextCleaner cleaner;
  private final AnswerGrouper grouper;

  public Ingestor(DataDir dataDir, TextCleaner cleaner, AnswerGrouper grouper) {
    this.dataDir = dataDir;
    this.cleaner = cleaner;
    this.grouper = grouper;
  }

  /**
   * Reads and validates {@code file} without storing anything.
   *
   * @return the valid tickets, in file order (a later row with the same id replaces an earlier one)
   */
  public ParsedExport parse(Path file, ExportFormat format, ColumnMapping mapping, Progress progress)
      throws IngestException {
    ExportReader reader = new ExportReader(file, format);
    reader.checkFile();
    RowValidator validator = new RowValidator(file.toString(), file.getFileName().toString(),
        mapping, cleaner);
    Map<String, Ticket> tickets = new LinkedHashMap<>();
    List<RowProblem> problems = new ArrayList<>();
    long[] read = {0};
    long[] rejected = {0};
    double[] share = {0};
    reader.read(new LinkedHashSet<>(mapping.mapped().values()), row -> {
      read[0]++;
      Ticket t = validator.validate(row, problems);
      if (t != null) {
        tickets.remove(t.id());
        tickets.put(t.id(), t);
      } else {
        rejected[0]++;
      }
      progress.update(read[0], share[0]);
    }, s -> share[0] = s);
    progress.finish(read[0]);
    return new ParsedExport(file.toString(), read[0], rejected[0], List.copyOf(tickets.values()),
        problems);
  }

  /** Parses {@code file} and stores its valid tickets. */
  public IngestReport ingest(Path file, ExportFormat format, ColumnMapping mapping,
      Progress reading, Progress indexing) throws IngestException, IOException {
    ParsedExport parsed = parse(file, format, mapping, reading);
    return store(parsed, indexing);
  }

  /** Stores parsed tickets: merge by id, regroup, re-index, switch atomically. */
  public IngestReport store(ParsedExport parsed, Progress indexing) throws IOException {
    try (FileLock lock = dataDir.lock()) {
      Map<String, Ticket> all = new LinkedHashMap<>();
      List<String> sources = new ArrayList<>();
      Optional<Knowledge> current = Knowledge.open(dataDir);
      if (current.isPresent()) {
        try (Knowledge k = current.get()) {
          all.putAll(k.tickets());
          sources.addAll(k.manifest().sources());
        }
      }
      long stored = 0;
      for (Ticket t : parsed.tickets()) {
        if (all.put(t.id(), t) == null) {
          stored++;
        }
      }
      // Rows that replaced a stored ticket, or an earlier row of the same file, are updates.
      long updated = parsed.read() - parsed.rejected() - stored;
      sources.add(parsed.file());
      List<Ticket> tickets = List.copyOf(all.values());
      Grouping grouping = grouper.group(tickets);
      if (!parsed.tickets().isEmpty()) {
        Knowledge.replace(dataDir, tickets, grouping, sources, indexing);
      }
      List<IngestReport.GroupSize> sizes = new ArrayList<>();
      for (AnswerGroup g : grouping.groups()) {
        sizes.add(new IngestReport.GroupSize(g.id(), g.size(), g.category(), g.canonical()));
      }
      return new IngestReport(parsed.file(), parsed.read(), stored, updated, parsed.rejected(),
          parsed.problems(), tickets.size(), sizes,
          grouping.oneOffs().size(), grouping.method());
    }
  }

  /**
   * A file's valid tickets and the problems of its other rows.
   *
   * @param file     the file read
   * @param read     rows read
   * @param rejected rows rejected
   * @param tickets  valid tickets, cleaned (one per id: a later row replaces an earlier one)
   * @param problems what is wrong with each rejected row, in file order
   */
  public record ParsedExport(String file, long read, long rejected, List<Ticket> tickets,
      List<RowProblem> problems) {
    public ParsedExport {
      tickets = List.copyOf(tickets);
      problems = List.copyOf(problems);
    }
  }
}
