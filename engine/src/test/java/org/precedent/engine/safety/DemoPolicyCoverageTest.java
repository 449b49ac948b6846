package org.precedent.engine.safety;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The demo policy against the demo help desk's answer key: safety tickets must reach a person, and routine tickets
 * should rarely be held back. The 90% and 3% bars are this project's own targets, not outside figures.
 */
class DemoPolicyCoverageTest {

  private record DemoTicket(String id, String text, String category, String template) {
    boolean safety() {
      return template.startsWith("safety.");
    }

    boolean oneOff() {
      return template.startsWith("oneoff");
    }
  }

  private static SafetyPolicy policy;
  private static List<DemoTicket> tickets;

  @BeforeAll
  static void load() throws IOException {
    Path demo = root().resolve("demo-data");
    policy = SafetyPolicy.load(demo.resolve("safety.rules"));
    tickets = new ArrayList<>(read(demo.resolve("tickets.csv")));
    tickets.addAll(read(demo.resolve("heldout.csv")));
  }

  @Test
  void everySafetyTicketIsHeldForAPersonAndNineInTenByTheirWordsAlone() {
    int safety = 0;
    int byTerms = 0;
    List<String> caughtOnlyByCategory = new ArrayList<>();
    for (DemoTicket t : tickets) {
      if (!t.safety()) {
        continue;
      }
      safety++;
      boolean term = policy.check(t.text(), null, null).isPresent();
      if (term) {
        byTerms++;
      } else {
        caughtOnlyByCategory.add(t.id() + " " + t.template() + ": " + oneLine(t.text()));
      }
      assertTrue(policy.check(t.text(), t.category(), null).isPresent(),
          () -> "safety ticket not held: " + t.id() + " " + oneLine(t.text()));
    }
    double rate = (double) byTerms / safety;
    System.out.printf(Locale.ROOT, "safety tickets caught by terms alone: %d of %d (%.1f%%)%n",
        byTerms, safety, 100 * rate);
    caughtOnlyByCategory.forEach(s -> System.out.println("  by category only: " + s));
    assertTrue(safety > 100, "expected the demo data to hold safety tickets, found " + safety);
    assertTrue(rate >= 0.90, () -> String.format(Locale.ROOT, "only %.1f%% caught by terms", 100 * rate));
  }

  @Test
  void atMostThreePercentOfRoutineTicketsAreHeldBackByATerm() {
    int routine = 0;
    List<String> held = new ArrayList<>();
    for (DemoTicket t : tickets) {
      if (t.safety() || t.oneOff()) {
        continue;
      }
      routine++;
      policy.check(t.text(), null, null).ifPresent(f ->
          held.add(t.id() + " " + t.template() + " [" + f.ruleId() + ": " + f.matched() + "]"));
    }
    double rate = (double) held.size() / routine;
    System.out.printf(Locale.ROOT, "routine tickets held back by a term: %d of %d (%.2f%%)%n",
        held.size(), routine, 100 * rate);
    held.forEach(s -> System.out.println("  held: " + s));
    assertTrue(routine > 1000, "expected routine tickets in the demo data, found " + routine);
    assertTrue(rate <= 0.03, () -> String.format(Locale.ROOT, "%.2f%% of routine tickets held back", 100 * rate));
  }

  private static List<DemoTicket> read(Path csv) throws IOException {
    List<DemoTicket> out = new ArrayList<>();
    try (Reader in = Files.newBufferedReader(csv, StandardCharsets.UTF_8);
        CSVParser parser = CSVParser.builder().setReader(in)
            .setFormat(CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get()).get()) {
      for (CSVRecord r : parser) {
        out.add(new DemoTicket(r.get("ticket_id"), r.get("subject") + "\n" + r.get("body"), r.get("category"),
            r.get("template")));
      }
    }
    return out;
  }

  private static String oneLine(String text) {
    String flat = text.replaceAll("\\s+", " ");
    return flat.length() > 160 ? flat.substring(0, 160) + "..." : flat;
  }

  /** The project root: surefire's precedent.root, else the nearest directory upwards holding demo-data. */
  private static Path root() {
    String configured = System.getProperty("precedent.root");
    if (configured != null && Files.isDirectory(Path.of(configured, "demo-data"))) {
      return Path.of(configured);
    }
    for (Path dir = Path.of(System.getProperty("user.dir")).toAbsolutePath(); dir != null; dir = dir.getParent()) {
      if (Files.isDirectory(dir.resolve("demo-data"))) {
        return dir;
      }
    }
    throw new IllegalStateException("cannot find the project root holding demo-data/");
  }
}
