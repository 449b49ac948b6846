package org.precedent.demo;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Collectors;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class DemoTicketGeneratorTest {

  private static List<DemoTicket> training;
  private static List<DemoTicket> heldOut;

  @BeforeAll
  static void generateDefaults() {
    training = DemoTicketGenerator.generate(DemoTicketGenerator.DEFAULT_COUNT, DemoTicketGenerator.DEFAULT_SEED);
    heldOut = DemoTicketGenerator.generateHeldOut(
        DemoTicketGenerator.DEFAULT_HELD_OUT, DemoTicketGenerator.DEFAULT_SEED, training);
  }

  @Test
  void regeneratingReproducesTheCommittedDemoDataByteForByte(@TempDir Path tmp) throws IOException {
    DemoTicketGenerator.main(new String[] {
        "--out", tmp.toString(),
        "--count", Integer.toString(DemoTicketGenerator.DEFAULT_COUNT),
        "--heldout", Integer.toString(DemoTicketGenerator.DEFAULT_HELD_OUT),
        "--seed", Long.toString(DemoTicketGenerator.DEFAULT_SEED)});
    Path committed = repoRoot().resolve("demo-data");
    for (String name : List.of("tickets.csv", "heldout.csv", "mapping.properties")) {
      assertSameBytes(committed.resolve(name), tmp.resolve(name));
    }
    try (var files = Files.list(tmp)) {
      assertEquals(3, files.count(), "no temporary files may be left behind");
    }
  }

  @Test
  void theSameSeedGivesTheSameTicketsAndAnotherSeedDoesNot() {
    assertEquals(DemoTicketGenerator.generate(150, 7), DemoTicketGenerator.generate(150, 7));
    assertNotEquals(DemoTicketGenerator.generate(150, 7), DemoTicketGenerator.generate(150, 8));
  }

  @Test
  void trainingHasTheVolumeAndMixTheDemoNeeds() {
    assertTrue(training.size() >= 3000, "training tickets: " + training.size());
    Set<String> reusable = training.stream().filter(t -> !t.isOneOff()).map(DemoTicket::template)
        .collect(Collectors.toSet());
    assertTrue(reusable.size() >= 40, "reusable answers used: " + reusable.size());
    assertTrue(DemoAnswers.routine().size() >= 45, "routine answers in catalogue: " + DemoAnswers.routine().size());

    double oneOffShare = share(training, DemoTicket::isOneOff);
    assertTrue(oneOffShare >= 0.08 && oneOffShare <= 0.12, "one-off share " + oneOffShare);
    double safetyShare = share(training, t -> t.category().equals("safety"));
    assertTrue(safetyShare >= 0.03 && safetyShare <= 0.07, "safety share " + safetyShare);
    assertTrue(training.stream().anyMatch(t -> t.template().startsWith("safety.")), "safety answers present");

    for (DemoTicket t : training) {
      if (t.isOneOff()) {
        assertEquals(DemoOneOffs.KEY_PREFIX + t.ticketId().substring(2), t.template());
        assertTrue(Set.of("complaint", "legal", "other").contains(t.category()), t.category());
      } else {
        assertEquals(t.template().substring(0, t.template().indexOf('.')), t.category());
      }
    }
  }

  @Test
  void ticketIdsAreWellFormedUniqueAndDisjointBetweenSplits() {
    Set<String> trainingIds = new HashSet<>();
    for (DemoTicket t : training) {
      assertTrue(t.ticketId().matches("T-1\\d{5}"), t.ticketId());
      assertTrue(trainingIds.add(t.ticketId()), "duplicate id " + t.ticketId());
    }
    assertEquals("T-100001", training.get(0).ticketId());
    Set<String> heldOutIds = new HashSet<>();
    for (DemoTicket t : heldOut) {
      assertTrue(t.ticketId().matches("H-5\\d{5}"), t.ticketId());
      assertTrue(heldOutIds.add(t.ticketId()), "duplicate id " + t.ticketId());
      assertFalse(trainingIds.contains(t.ticketId()));
    }
    Set<String> oneOffKeys = new HashSet<>();
    for (DemoTicket t : concat(training, heldOut)) {
      if (t.isOneOff()) {
        assertTrue(oneOffKeys.add(t.template()), "one-off key reused: " + t.template());
      }
    }
  }

  @Test
  void heldOutQuestionsAreNotCopiesOfTrainingQuestions() {
    Set<String> seen = training.stream().map(t -> DemoTicketGenerator.normalise(t.body())).collect(Collectors.toSet());
    for (DemoTicket t : heldOut) {
      assertFalse(seen.contains(DemoTicketGenerator.normalise(t.body())), "copied question in " + t.ticketId());
    }
    assertTrue(heldOut.stream().anyMatch(DemoTicket::isOneOff), "held-out needs unseen one-offs too");
  }

  @Test
  void createdTimesAreOrderedAndInsideTheScenarioPeriod() {
    Instant first = Instant.parse("2025-01-01T00:00:00Z");
    Instant end = Instant.parse("2026-11-01T00:00:00Z");
    for (List<DemoTicket> split : List.of(training, heldOut)) {
      Instant previous = first;
      for (DemoTicket t : split) {
        Instant created = Instant.parse(t.created());
        assertFalse(created.isBefore(previous), t.ticketId() + " is out of order");
        assertTrue(created.isBefore(end), t.created());
        previous = created;
      }
    }
  }

  @Test
  void everyAnswerHasSeveralDistinctPhrasingsAndACompactAnswer() {
    for (DemoAnswer a : DemoAnswers.all()) {
      assertTrue(new HashSet<>(a.questions()).size() >= 8, a.key() + " has too few question phrasings");
      assertEquals(a.questions().size(), new HashSet<>(a.questions()).size(), a.key() + " repeats a phrasing");
      assertTrue(a.subjects().size() >= 3, a.key() + " has too few subject lines");
      int sentences = a.answer().split("(?<=[.!?])\\s+(?=[A-Z])").length;
      assertTrue(sentences >= 2 && sentences <= 6, a.key() + " answer has " + sentences + " sentences");
    }
  }

  @Test
  void generatedQuestionsForOneAnswerRarelyRepeat() {
    Map<String, List<DemoTicket>> byTemplate = training.stream().filter(t -> !t.isOneOff())
        .collect(Collectors.groupingBy(DemoTicket::template));
    for (Map.Entry<String, List<DemoTicket>> e : byTemplate.entrySet()) {
      List<DemoTicket> tickets = e.getValue();
      long distinct = tickets.stream().map(t -> DemoTicketGenerator.normalise(t.body())).distinct().count();
      assertTrue(distinct >= tickets.size() * 0.9, e.getKey() + ": " + distinct + " distinct of " + tickets.size());
    }
  }

  @Test
  void oneOffRepliesAreIndividual() {
    List<DemoTicket> oneOffs = concat(training, heldOut).stream().filter(DemoTicket::isOneOff).toList();
    assertEquals(oneOffs.size(), oneOffs.stream().map(DemoTicket::reply).distinct().count());
    List<Set<String>> words = oneOffs.stream().map(t -> DemoOneOffs.replyWords(t.reply())).toList();
    for (int i = 0; i < oneOffs.size(); i++) {
      Set<String> a = words.get(i);
      for (int j = i + 1; j < oneOffs.size(); j++) {
        Set<String> b = words.get(j);
        long common = a.stream().filter(b::contains).count();
        double jaccard = common / (double) (a.size() + b.size() - common);
        assertTrue(jaccard < 0.8, oneOffs.get(i).ticketId() + " and " + oneOffs.get(j).ticketId() + " read alike");
      }
    }
  }

  @Test
  void customerTextCarriesPersonalDataAndOrdinaryNumbers() {
    String bodies = training.stream().map(DemoTicket::body).collect(Collectors.joining("\n"));
    assertTrue(Pattern.compile("(?i)\\btvw[- ]?\\d{8}\\b").matcher(bodies).find(), "account numbers");
    for (String form : List.of("+44 7700 900", "07700 900", "01632 960", "4111 1111 1111 1111",
        "GB82 WEST 1234 5698 7654 32", "\n> ", "TVWW Customer Care wrote:", "Sent from my phone", "£")) {
      assertTrue(bodies.contains(form), "missing " + form);
    }
    assertTrue(Pattern.compile("\\b\\d{2}/\\d{2}/20\\d{2}\\b").matcher(bodies).find(), "numeric dates");
    assertTrue(Pattern.compile("\\bTV\\d{1,2} \\d[A-Z]{2}\\b").matcher(bodies).find(), "postcodes");
    assertTrue(Pattern.compile("\\b0\\d{4}\\b").matcher(bodies).find(), "meter readings");
  }

  @Test
  void phoneNumbersAndEmailsAreOnlyFictional() {
    Pattern mobile = Pattern.compile("(?:\\+44\\s?|\\b0)7\\d{3}\\s?\\d{3}\\s?\\d{3}\\b");
    Pattern landline = Pattern.compile("\\(?\\b01\\d{3}\\)?\\s?\\d{3}\\s?\\d{3}\\b");
    Pattern email = Pattern.compile("[\\w.+-]+@([\\w-]+(?:\\.[\\w-]+)+)");
    for (DemoTicket t : concat(training, heldOut)) {
      String text = t.subject() + "\n" + t.body() + "\n" + t.reply();
      Matcher m = mobile.matcher(text);
      while (m.find()) {
        assertTrue(m.group().replaceAll("\\D", "").matches("(44|0)7700900\\d{3}"), t.ticketId() + ": " + m.group());
      }
      m = landline.matcher(text);
      while (m.find()) {
        assertTrue(m.group().replaceAll("\\D", "").startsWith("01632960"), t.ticketId() + ": " + m.group());
      }
      m = email.matcher(text);
      while (m.find()) {
        String domain = m.group(1);
        assertTrue(domain.matches("example\\.(com|org|net)|.*\\.example"), t.ticketId() + ": " + m.group());
      }
    }
  }

  @Test
  void csvRoundTripsEveryField() throws IOException {
    List<DemoTicket> sample = training.subList(0, 400);
    String csv = DemoTicketGenerator.toCsv(sample);
    assertTrue(csv.startsWith(String.join(",", DemoTicketGenerator.HEADER) + "\n"));
    assertFalse(csv.contains("\r"), "one line-ending style throughout");
    CSVFormat format = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get();
    try (CSVParser parser = CSVParser.parse(new StringReader(csv), format)) {
      List<CSVRecord> records = parser.getRecords();
      assertEquals(sample.size(), records.size());
      for (int i = 0; i < sample.size(); i++) {
        CSVRecord r = records.get(i);
        DemoTicket t = sample.get(i);
        assertEquals(t, new DemoTicket(r.get("ticket_id"), r.get("subject"), r.get("body"), r.get("reply"),
            r.get("category"), r.get("created"), r.get("template")));
      }
    }
  }

  @Test
  void mappingLeavesTheAnswerKeyUnmapped() {
    Map<String, String> mapping = new HashMap<>();
    for (String line : DemoTicketGenerator.mapping().split("\n")) {
      if (!line.isBlank() && !line.startsWith("#")) {
        String[] kv = line.split("=", 2);
        mapping.put(kv[0], kv[1]);
      }
    }
    assertEquals(Map.of("id", "ticket_id", "subject", "subject", "body", "body", "reply", "reply",
        "category", "category", "created", "created"), mapping);
  }

  private static double share(List<DemoTicket> tickets, java.util.function.Predicate<DemoTicket> p) {
    return tickets.stream().filter(p).count() / (double) tickets.size();
  }

  private static List<DemoTicket> concat(List<DemoTicket> a, List<DemoTicket> b) {
    return java.util.stream.Stream.concat(a.stream(), b.stream()).toList();
  }

  private static void assertSameBytes(Path expected, Path actual) throws IOException {
    assertTrue(Files.exists(expected), "missing committed file " + expected);
    byte[] e = Files.readAllBytes(expected);
    byte[] a = Files.readAllBytes(actual);
    if (java.util.Arrays.equals(e, a)) {
      return;
    }
    String[] el = new String(e, StandardCharsets.UTF_8).split("\n", -1);
    String[] al = new String(a, StandardCharsets.UTF_8).split("\n", -1);
    for (int i = 0; i < Math.min(el.length, al.length); i++) {
      if (!el[i].equals(al[i])) {
        fail(expected.getFileName() + " differs from regenerated output at line " + (i + 1)
            + "\n  committed:   " + el[i] + "\n  regenerated: " + al[i]
            + "\nRegenerate the demo data as described in demo-data/README.md if the change is intended.");
      }
    }
    fail(expected.getFileName() + " differs in length: " + el.length + " vs " + al.length + " lines");
  }

  /** The project root: from surefire's precedent.root, else the nearest directory upwards holding demo-data. */
  private static Path repoRoot() {
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
