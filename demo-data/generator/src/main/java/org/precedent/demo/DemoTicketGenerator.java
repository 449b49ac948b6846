package org.precedent.demo;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.PosixFilePermissions;
import java.time.DayOfWeek;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Collection;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;

/**
 * Generates the demo help-desk history of Tarnwick Vale Water &amp; Waste, an invented water and waste-collection
 * utility: resolved tickets whose replies reuse a catalogue of answers, with safety cases a person must answer and
 * one-off cases with individual replies.
 *
 * <p>Output is fully determined by the seed: {@link java.util.Random} is specified to give the same sequence on
 * every Java platform, and nothing else (clock, locale, hash order) feeds in, so the committed demo files can be
 * checked by regenerating them.
 */
public final class DemoTicketGenerator {

  public static final long DEFAULT_SEED = 20261201L;
  /** One-off replies a new one-off is kept distinct from. */
  private static final int ONE_OFF_WINDOW = 1000;
  public static final int DEFAULT_COUNT = 3600;
  public static final int DEFAULT_HELD_OUT = 600;
  public static final List<String> HEADER =
      List.of("ticket_id", "subject", "body", "reply", "category", "created", "template");

  static final int TRAINING_FIRST = 100_001;
  static final int HELD_OUT_FIRST = 500_001;
  /** The most word overlap (Jaccard) a one-off reply should have with any other one-off reply. */
  static final double ONE_OFF_MAX_SIMILARITY = 0.7;
  private static final LocalDate FIRST_DAY = LocalDate.of(2025, 1, 1);
  private static final LocalDate LAST_DAY = LocalDate.of(2026, 10, 31);

  /** Quoted only where needed, LF throughout: one line-ending style in the whole file, inside fields and out. */
  private static final CSVFormat CSV = CSVFormat.RFC4180.builder()
      .setHeader(HEADER.toArray(String[]::new))
      .setRecordSeparator("\n")
      .get();

  private DemoTicketGenerator() {
  }

  /** Training history: {@code count} tickets with ids from {@code T-100001}, in order of creation. */
  public static List<DemoTicket> generate(int count, long seed) {
    return generate(count, seed, "T-", TRAINING_FIRST, Set.of(), new ArrayList<>());
  }

  /**
   * Held-out tickets for evaluation, drawn from a stream derived from {@code seed} but unrelated to the training
   * stream, with ids from {@code H-500001}. A message that repeats a training message word for word is drawn
   * again, so evaluation never rewards remembering the training set.
   */
  public static List<DemoTicket> generateHeldOut(int count, long seed, Collection<DemoTicket> training) {
    Set<String> seen = new HashSet<>();
    List<Set<String>> oneOffs = new ArrayList<>();
    for (DemoTicket t : training) {
      seen.add(normalise(t.body()));
      if (t.isOneOff()) {
        oneOffs.add(DemoOneOffs.replyWords(t.reply()));
      }
    }
    return generate(count, heldOutSeed(seed), "H-", HELD_OUT_FIRST, seen, oneOffs);
  }

  /** SplitMix64's finaliser: consecutive seeds give unrelated streams. */
  static long heldOutSeed(long seed) {
    long z = seed + 0x9E3779B97F4A7C15L;
    z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
    z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
    return z ^ (z >>> 31);
  }

  static String normalise(String body) {
    return body.toLowerCase(Locale.ROOT).replaceAll("\\s+", " ").trim();
  }

  private static List<DemoTicket> generate(int count, long seed, String prefix, int first, Set<String> avoid,
      List<Set<String>> oneOffs) {
    Random r = new Random(seed);
    List<Instant> times = createdTimes(count, r);
    DemoWeightedAnswers routine = new DemoWeightedAnswers(DemoAnswers.routine());
    DemoWeightedAnswers safety = new DemoWeightedAnswers(DemoAnswers.safety());
    List<DemoTicket> out = new ArrayList<>(count);
    for (int i = 0; i < count; i++) {
      int number = first + i;
      DemoTicket t;
      int attempts = 0;
      do {
        t = ticket(prefix + number, number, times.get(i), routine, safety, r);
        if (t.isOneOff()) {
          t = distinctOneOff(t, oneOffs, prefix + number, number, times.get(i), r);
        }
      } while (avoid.contains(normalise(t.body())) && ++attempts < 50);
      if (t.isOneOff()) {
        oneOffs.add(DemoOneOffs.replyWords(t.reply()));
      }
      out.add(t);
    }
    return out;
  }

  /**
   * Redraws a one-off until its reply shares few words with every earlier one-off reply, keeping the most
   * distinct draw if none is distinct enough: a one-off answer must not quietly become a reusable one.
   */
  private static DemoTicket distinctOneOff(DemoTicket first, List<Set<String>> all, String id, int number,
      Instant created, Random r) {
    // Compared with the latest one-offs only, so that generating 100,000 tickets for a benchmark stays
    // linear; the demo's few hundred one-offs are all within the window.
    List<Set<String>> earlier = all.subList(Math.max(0, all.size() - ONE_OFF_WINDOW), all.size());
    DemoTicket best = first;
    double bestSimilarity = DemoOneOffs.maxSimilarity(DemoOneOffs.replyWords(first.reply()), earlier);
    for (int attempt = 0; attempt < 40 && bestSimilarity > ONE_OFF_MAX_SIMILARITY; attempt++) {
      DemoTicket t = oneOff(id, number, created, new DemoSlots(r, created), r);
      double similarity = DemoOneOffs.maxSimilarity(DemoOneOffs.replyWords(t.reply()), earlier);
      if (similarity < bestSimilarity) {
        best = t;
        bestSimilarity = similarity;
      }
    }
    return best;
  }

  private static DemoTicket ticket(String id, int number, Instant created, DemoWeightedAnswers routine,
      DemoWeightedAnswers safety, Random r) {
    DemoSlots s = new DemoSlots(r, created);
    int month = s.opened.getMonthValue();
    int roll = r.nextInt(1000);
    if (roll < 100) {
      return oneOff(id, number, created, s, r);
    }
    boolean isSafety = roll < 146;
    DemoAnswer a = (isSafety ? safety : routine).pick(month, r);
    String question = s.fill(DemoPeople.pick(a.questions(), r));
    DemoCustomerText.Message m = DemoCustomerText.compose(question, s, r);
    String reply = DemoReplies.reply(s.fill(a.answer()), s, m,
        isSafety ? DemoReplies.Voice.SAFETY : DemoReplies.Voice.ROUTINE, r);
    String subject = subject(s.fill(DemoPeople.pick(a.subjects(), r)), s, r);
    return new DemoTicket(id, subject, m.body(), reply, a.category(), created.toString(), a.key());
  }

  private static DemoTicket oneOff(String id, int number, Instant created, DemoSlots s, Random r) {
    DemoOneOffs.OneOff o = DemoOneOffs.compose(s, r);
    DemoCustomerText.Message m = o.letter()
        ? DemoCustomerText.composeLetter(o.question(), o.signature(), s, r)
        : DemoCustomerText.compose(o.question(), s, r);
    DemoReplies.Voice voice = switch (o.category()) {
      case "complaint" -> DemoReplies.Voice.COMPLAINT;
      case "legal" -> DemoReplies.Voice.LEGAL;
      default -> DemoReplies.Voice.OTHER;
    };
    String reply = DemoReplies.reply(o.reply(), s, m, voice, r);
    return new DemoTicket(id, subject(o.subject(), s, r), m.body(), reply, o.category(), created.toString(),
        DemoOneOffs.key(number));
  }

  /** Subject lines as they arrive: sometimes blank, forwarded, replied to, shouted, or carrying an account number. */
  private static String subject(String subject, DemoSlots s, Random r) {
    int roll = r.nextInt(100);
    if (roll < 5) {
      return "";
    } else if (roll < 13) {
      return "Re: " + subject;
    } else if (roll < 16) {
      return "Fwd: " + subject;
    } else if (roll < 21) {
      return subject.toLowerCase(Locale.ROOT);
    } else if (roll < 26) {
      return subject + " - " + s.account;
    } else if (roll < 30) {
      return subject + " (ref " + s.get("ref") + ")";
    }
    return subject;
  }

  /** Creation times over 2025-01 to 2026-10, mostly in office hours and on weekdays, in ascending order. */
  private static List<Instant> createdTimes(int count, Random r) {
    int days = (int) ChronoUnit.DAYS.between(FIRST_DAY, LAST_DAY) + 1;
    List<Instant> times = new ArrayList<>(count);
    for (int i = 0; i < count; i++) {
      LocalDate day = FIRST_DAY.plusDays(r.nextInt(days));
      if ((day.getDayOfWeek() == DayOfWeek.SATURDAY || day.getDayOfWeek() == DayOfWeek.SUNDAY) && r.nextBoolean()) {
        day = FIRST_DAY.plusDays(r.nextInt(days));
      }
      int roll = r.nextInt(100);
      int hour = roll < 72 ? 8 + r.nextInt(10) : roll < 92 ? 18 + r.nextInt(5) : r.nextInt(8);
      long second = hour * 3600L + r.nextInt(3600);
      times.add(day.atStartOfDay(ZoneOffset.UTC).toInstant().plusSeconds(second));
    }
    times.sort(null);
    return times;
  }

  /** The tickets as RFC 4180 CSV text with a header row. */
  public static String toCsv(List<DemoTicket> tickets) {
    StringBuilder out = new StringBuilder(tickets.size() * 1200);
    try (CSVPrinter p = new CSVPrinter(out, CSV)) {
      for (DemoTicket t : tickets) {
        p.printRecord(t.ticketId(), t.subject(), t.body(), t.reply(), t.category(), t.created(), t.template());
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return out.toString();
  }

  /** Writes the tickets as UTF-8 CSV; readers never see a half-written file. */
  public static void writeCsv(List<DemoTicket> tickets, Path file) throws IOException {
    writeAtomically(file, toCsv(tickets));
  }

  /** Writes to a temporary file in the same directory, then renames it over the target in one step. */
  static void writeAtomically(Path file, String content) throws IOException {
    Path target = file.toAbsolutePath();
    Files.createDirectories(target.getParent());
    Path tmp = Files.createTempFile(target.getParent(), target.getFileName().toString(), ".tmp");
    try {
      Files.writeString(tmp, content, StandardCharsets.UTF_8);
      // Temporary files are created owner-only; the data files are meant to be shared like any other.
      if (Files.getFileStore(tmp).supportsFileAttributeView("posix")) {
        Files.setPosixFilePermissions(tmp, PosixFilePermissions.fromString("rw-r--r--"));
      }
      Files.move(tmp, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
    } finally {
      Files.deleteIfExists(tmp);
    }
  }

  /** The ingest column mapping for the demo files; the answer key column is left out on purpose. */
  static String mapping() {
    return """
        # Column mapping for ingesting the Tarnwick Vale demo tickets.
        # The template column is the generator's answer key, kept for evaluation only, and is deliberately not mapped.
        id=ticket_id
        subject=subject
        body=body
        reply=reply
        category=category
        created=created
        """;
  }

  /** The answer catalogue as a Markdown list, for the data set's README. */
  static String catalogueMarkdown() {
    StringBuilder out = new StringBuilder();
    for (Map.Entry<String, List<String>> e : DemoAnswers.keysByCategory().entrySet()) {
      out.append("- **").append(e.getKey()).append("**: `").append(String.join("`, `", e.getValue())).append("`\n");
    }
    return out.toString();
  }

  /** Writes {@code tickets.csv}, {@code heldout.csv} and {@code mapping.properties} into a directory. */
  public static void writeDemoData(Path dir, int count, int heldOut, long seed) throws IOException {
    List<DemoTicket> training = generate(count, seed);
    List<DemoTicket> held = generateHeldOut(heldOut, seed, training);
    writeCsv(training, dir.resolve("tickets.csv"));
    writeCsv(held, dir.resolve("heldout.csv"));
    writeAtomically(dir.resolve("mapping.properties"), mapping());
  }

  public static void main(String[] args) throws IOException {
    Path out = Path.of("demo-data");
    int count = DEFAULT_COUNT;
    int heldOut = DEFAULT_HELD_OUT;
    long seed = DEFAULT_SEED;
    for (int i = 0; i < args.length; i++) {
      switch (args[i]) {
        case "--out" -> out = Path.of(value(args, ++i));
        case "--count" -> count = Integer.parseInt(value(args, ++i));
        case "--heldout" -> heldOut = Integer.parseInt(value(args, ++i));
        case "--seed" -> seed = Long.parseLong(value(args, ++i));
        case "--catalogue" -> {
          System.out.print(catalogueMarkdown());
          return;
        }
        default -> throw new IllegalArgumentException(
            "unknown argument " + args[i] + "; use --out DIR --count N --heldout M --seed S, or --catalogue");
      }
    }
    writeDemoData(out, count, heldOut, seed);
    System.out.printf(Locale.ROOT, "wrote %d training and %d held-out tickets (seed %d) to %s%n",
        count, heldOut, seed, out.toAbsolutePath().normalize());
  }

  private static String value(String[] args, int i) {
    if (i >= args.length) {
      throw new IllegalArgumentException(args[i - 1] + " needs a value");
    }
    return args[i];
  }
}
