package org.precedent.knowledge.ingest;

import java.io.IOException;
import java.nio.channels.FileLock;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;
import org.precedent.knowledge.clean.OwnDetails;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.group.AnswerGroup;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.group.Grouping;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.embed.Encoders;
import org.precedent.knowledge.embed.QuestionVectors;
import org.precedent.knowledge.embed.SentenceEncoder;
import org.precedent.knowledge.retrieve.Retriever;
import org.precedent.knowledge.retrieve.TicketIndex;
import org.precedent.knowledge.store.Manifest;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;
import org.precedent.knowledge.ticket.Ticket;

/**
 * Ingests an export of resolved tickets: read, validate, clean, merge with what is stored (same id
 * replaces), regroup, re-index, and put the new knowledge in force in one atomic step.
 *
 * <p>A bad row is reported and skipped; a bad file (missing, empty, not text, mostly not UTF-8,
 * lacking a mapped column, a quote never closed) stops the ingest before anything changes. Within
 * one file an id belongs to one row: a later row with the id of an earlier one is rejected and
 * the earlier one kept, since an export that repeats an id is more likely wrong than a history.
 */
public final class Ingestor {
  private final DataDir dataDir;
  private final TextCleaner cleaner;
  private final AnswerGrouper grouper;
  /** The encoder of the dense leg, or empty for BM25 only. */
  private final Optional<SentenceEncoder.Model> encoder;

  /**
   * A contact detail in the replies of this many answer groups is proposed as the organisation's
   * own: a customer's number turns up in their own tickets, not across unrelated answers. Three is
   * this project's choice, not a published figure.
   */
  static final int PROPOSE_FROM_GROUPS = 3;

  /** An ingestor embedding with the encoder {@code -Dprecedent.encoder} names ({@link Encoders}). */
  public Ingestor(DataDir dataDir, TextCleaner cleaner, AnswerGrouper grouper) {
    this(dataDir, cleaner, grouper, Encoders.fromSetting());
  }

  private Ingestor(DataDir dataDir, TextCleaner cleaner, AnswerGrouper grouper,
      Optional<SentenceEncoder.Model> encoder) {
    this.dataDir = dataDir;
    this.cleaner = cleaner;
    this.grouper = grouper;
    this.encoder = encoder;
  }

  /** The same ingestor with another encoder for the dense leg, or none (BM25 only). */
  public Ingestor withEncoder(Optional<SentenceEncoder.Model> model) {
    return new Ingestor(dataDir, cleaner, grouper, model);
  }

  /**
   * The ingestor of a data directory: standard cleaning, keeping the organisation's own contact
   * details declared in it ({@link DataDir#ownDetails()}; an IOException names a bad line).
   */
  public static Ingestor of(DataDir dataDir, AnswerGrouper grouper) throws IOException {
    return new Ingestor(dataDir, TextCleaner.keeping(OwnDetails.read(dataDir.ownDetails())),
        grouper);
  }

  /**
   * Checks that {@code file} exists and looks like a text export, before anything else is asked
   * of the user (such as which column holds what).
   */
  public static void checkFile(Path file) throws IngestException {
    new ExportReader(file, ExportFormat.of(file)).checkFile();
  }

  /**
   * Reads and validates {@code file} without storing anything.
   *
   * @return the valid tickets, in file order (the first valid row of an id; later rows with that
   *     id are rejected as problems)
   */
  public ParsedExport parse(Path file, ExportFormat format, ColumnMapping mapping, Progress progress)
      throws IngestException {
    mapping.requireAnswer();
    ExportReader reader = new ExportReader(file, format);
    reader.checkFile();
    RowValidator validator = new RowValidator(file.toString(), file.getFileName().toString(),
        mapping, cleaner);
    List<Ticket> tickets = new ArrayList<>();
    Map<String, Long> lineOfId = new HashMap<>();
    List<RowProblem> problems = new ArrayList<>();
    long[] read = {0};
    long[] rejected = {0};
    double[] share = {0};
    Map<String, Contact> contacts = new HashMap<>();
    reader.read(new LinkedHashSet<>(mapping.mapped().values()), row -> {
      read[0]++;
      Ticket t = validator.validate(row, problems);
      Long first = t == null ? null : lineOfId.putIfAbsent(t.id(), row.line());
      if (t != null && first == null) {
        tickets.add(t);
        String rawReply = mapping.reply() == null ? null : row.values().get(mapping.reply());
        if (rawReply != null) {
          for (String c : TextCleaner.contactsIn(rawReply)) {
            // A detail still in the cleaned reply was kept as the organisation's own already.
            if (!t.reply().contains(c)) {
              contacts.computeIfAbsent(OwnDetails.key(c), k -> new Contact(c)).tickets.add(t.id());
            }
          }
        }
      } else {
        if (first != null) {
          problems.add(new RowProblem(file.toString(), row.line(), "id", "'" + t.id()
              + "' is already the id of line " + first + ", which is kept; this row is not stored"));
        }
        rejected[0]++;
      }
      progress.update(read[0], share[0]);
    }, s -> share[0] = s);
    progress.finish(read[0]);
    return new ParsedExport(file.toString(), read[0], rejected[0], tickets, problems,
        contacts.values().stream().filter(c -> c.tickets.size() >= PROPOSE_FROM_GROUPS)
            .map(c -> new ContactUse(c.written, List.copyOf(c.tickets))).toList());
  }

  /**
   * Reads new tickets (not yet answered) from {@code file} by the rules resolved ones are read by:
   * the same strict reading, field limits, id rules, cleaning (with this ingestor's cleaner) and
   * category rule, so a ticket reads the same at ingest and when it is decided.
   *
   * @param mapping a mapping of new tickets ({@link ColumnMapping#forNewTickets})
   * @return every record in file order, each with its question or its problem
   * @throws IngestException when the file as a whole cannot be read, saying what and where
   */
  public List<NewTicket> readNew(Path file, ExportFormat format, ColumnMapping mapping)
      throws IngestException {
    ExportReader reader = new ExportReader(file, format);
    reader.checkFile();
    RowValidator validator = new RowValidator(file.toString(), file.getFileName().toString(),
        mapping, cleaner);
    List<NewTicket> tickets = new ArrayList<>();
    reader.read(new LinkedHashSet<>(mapping.mapped().values()),
        row -> tickets.add(validator.validateNew(row)), s -> { });
    return tickets;
  }

  /** A contact detail found in raw replies, and the tickets whose replies hold it. */
  private static final class Contact {
    final String written;
    final Set<String> tickets = new LinkedHashSet<>();

    Contact(String written) {
      this.written = written;
    }
  }

  /** Parses {@code file} and stores its valid tickets. */
  public IngestReport ingest(Path file, ExportFormat format, ColumnMapping mapping,
      Progress reading, Progress indexing) throws IngestException, IOException {
    ParsedExport parsed = parse(file, format, mapping, reading);
    return store(parsed, indexing);
  }

  /** Stores parsed tickets: merge by id, regroup, re-index, switch atomically. */
  public IngestReport store(ParsedExport parsed, Progress indexing) throws IOException {
    return store(parsed, indexing, Progress.silent());
  }

  /**
   * Stores parsed tickets: merge by id, regroup, embed the questions the current generation holds
   * no vector of by this encoder (with {@code embedding} progress), re-index, switch atomically.
   */
  public IngestReport store(ParsedExport parsed, Progress indexing, Progress embedding)
      throws IOException {
    try (FileLock lock = dataDir.lock()) {
      Map<String, Ticket> all = new LinkedHashMap<>();
      List<String> sources = new ArrayList<>();
      Optional<Knowledge> current = Knowledge.open(dataDir);
      if (current.isPresent()) {
        all.putAll(current.get().tickets());
        sources.addAll(current.get().manifest().sources());
      }
      long stored = 0;
      for (Ticket t : parsed.tickets()) {
        if (all.put(t.id(), t) == null) {
          stored++;
        }
      }
      // Tickets that replaced a stored ticket are updates.
      long updated = parsed.read() - parsed.rejected() - stored;
      sources.add(parsed.file());
      List<Ticket> tickets = List.copyOf(all.values());
      Grouping grouping = grouper.group(tickets);
      if (!parsed.tickets().isEmpty()) {
        write(current, tickets, grouping, sources, indexing, embedding);
      }
      List<IngestReport.GroupSize> sizes = new ArrayList<>();
      for (AnswerGroup g : grouping.groups()) {
        sizes.add(new IngestReport.GroupSize(g.id(), g.size(), g.category(), g.canonical()));
      }
      return new IngestReport(parsed.file(), parsed.read(), stored, updated, parsed.rejected(),
          parsed.problems(), tickets.size(), sizes,
          grouping.oneOffs().size(), grouping.method(), proposals(parsed, grouping));
    }
  }

  /** A new generation, with the dense leg's vectors when there is an encoder. */
  private void write(Optional<Knowledge> current, List<Ticket> tickets, Grouping grouping,
      List<String> sources, Progress indexing, Progress embedding) throws IOException {
    if (encoder.isEmpty()) {
      Knowledge.replace(dataDir, tickets, grouping, sources, TicketIndex.builder(indexing));
      return;
    }
    try (SentenceEncoder e = SentenceEncoder.open(encoder.get())) {
      Knowledge.replace(dataDir, tickets, grouping, sources, TicketIndex.builder(indexing,
          embedding, e, reusable(current, e.identity())));
    }
  }

  /** The current generation's vectors, when the same encoder made them. */
  private static Map<String, QuestionVectors.Stored> reusable(Optional<Knowledge> current,
      SentenceEncoder.Identity identity) throws IOException {
    if (current.isEmpty() || current.get().manifest().vectors() == null) {
      return Map.of();
    }
    Manifest.Vectors made = current.get().manifest().vectors();
    if (!made.encoder().equals(identity.model()) || !made.sha256().equals(identity.sha256())) {
      return Map.of();
    }
    try (Retriever r = Retriever.open(current.get())) {
      return r.storedVectors();
    }
  }

  /** Contact details redacted from the replies of several answer groups, most groups first. */
  private static List<IngestReport.ProposedDetail> proposals(ParsedExport parsed,
      Grouping grouping) {
    Map<String, String> groupOf = grouping.groupOfTicket();
    List<IngestReport.ProposedDetail> proposed = new ArrayList<>();
    for (ContactUse use : parsed.contacts()) {
      long groups = use.tickets().stream().map(groupOf::get).filter(Objects::nonNull)
          .distinct().count();
      if (groups >= PROPOSE_FROM_GROUPS) {
        proposed.add(new IngestReport.ProposedDetail(OwnDetails.kind(use.written()),
            use.written(), (int) groups, use.tickets().size()));
      }
    }
    proposed.sort(Comparator.comparingInt(IngestReport.ProposedDetail::groups)
        .reversed().thenComparing(IngestReport.ProposedDetail::value));
    return proposed;
  }

  /**
   * A contact detail that redaction found in the raw replies of several tickets.
   *
   * @param written as first written
   * @param tickets the tickets whose replies hold it
   */
  public record ContactUse(String written, List<String> tickets) {
    public ContactUse {
      tickets = List.copyOf(tickets);
    }
  }

  /**
   * A file's valid tickets and the problems of its other rows.
   *
   * @param file     the file read
   * @param read     rows read
   * @param rejected rows rejected
   * @param tickets  valid tickets, cleaned, one per id
   * @param problems what is wrong with each rejected row, in file order
   * @param contacts contact details redacted from the replies of at least three tickets
   */
  public record ParsedExport(String file, long read, long rejected, List<Ticket> tickets,
      List<RowProblem> problems, List<ContactUse> contacts) {
    public ParsedExport {
      tickets = List.copyOf(tickets);
      problems = List.copyOf(problems);
      contacts = List.copyOf(contacts);
    }
  }
}
