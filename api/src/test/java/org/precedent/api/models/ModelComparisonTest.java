package org.precedent.api.models;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.Reader;
import java.io.StringWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVPrinter;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.RegisterExtension;
import org.precedent.api.cli.PrecedentCommand;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.Http.Reply;
import org.precedent.api.testing.ServiceForClass;
import org.precedent.api.testing.TrainedData;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.evaluate.HeldOutEvaluation;
import org.precedent.engine.evaluate.VersionComparison;
import org.precedent.engine.evaluate.VersionComparisons;
import org.precedent.engine.learn.TeamModelTrainer;
import org.precedent.engine.rerank.ModelLoadException;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.ingest.ColumnMapping;
import org.precedent.knowledge.ingest.ExportFormat;
import org.precedent.knowledge.ingest.Ingestor;
import org.precedent.knowledge.io.AtomicFiles;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;

/**
 * A new model earns its place: train keeps it a candidate once a version is in force; evaluate
 * measures it beside the version in force on the same held-out tickets and keeps the comparison;
 * activation, through the service or the command line, shows it, is refused for a worse or
 * uncompared candidate unless acknowledged with a reason, and the audit keeps the comparison.
 *
 * <p>The worse candidate is v-0001 with its calibration made flat (every confidence 0.5), a valid
 * version by its manifest: it ranks as v-0001 does, but no threshold can be guaranteed for it.
 */
class ModelComparisonTest {
  /** Held-out tickets measured: enough for the tiny model to get a guaranteed threshold at 85%. */
  static final int HELD_OUT = 120;
  static final double TARGET = 0.85;

  @RegisterExtension
  static final ServiceForClass service = new ServiceForClass();

  static Path copy;
  static Path heldOut;
  static String evaluateOutput;
  static VersionComparison.Figures inForceAlone;
  static VersionComparison.Figures candidateAlone;

  @BeforeAll
  static void compared() throws Exception {
    long start = System.nanoTime();
    copy = TrainedData.copy();
    heldOut = copy.resolve("heldout-" + HELD_OUT + ".csv");
    Path demo = TrainedData.root().resolve("demo-data");
    firstRows(demo.resolve("heldout.csv"), heldOut, HELD_OUT);
    flatVersion(copy, "v-0003");
    flatVersion(service.data(), "v-0003");
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int status = PrecedentCommand.run(new PrintWriter(out, true), new PrintWriter(err, true),
        "--data", copy.toString(), "evaluate", heldOut.toString(), "--mapping",
        demo.resolve("mapping.properties").toString(), "--target", String.valueOf(TARGET),
        "--candidate", "v-0003", "--apply");
    evaluateOutput = out.toString();
    assertEquals(0, status, err + "\n" + out);
    // The same data and versions in the service's directory: the comparison holds there too.
    Path file = VersionComparisons.file(new ModelStore(copy.resolve("models")), "v-0003",
        "v-0001");
    Path target = service.data().resolve(copy.relativize(file).toString());
    Files.createDirectories(target.getParent());
    Files.copy(file, target);
    // Each version as engine.evaluate measures it on its own, on the same tickets.
    DataDir dir = new DataDir(copy);
    Ingestor.ParsedExport parsed = Ingestor.of(dir, AnswerGrouper.standard()).parse(heldOut,
        ExportFormat.CSV, ColumnMapping.fromFile(demo.resolve("mapping.properties"), Map.of()),
        Progress.silent());
    // The version in force's own report is the one evaluate writes for the manager's page.
    inForceAlone = VersionComparison.Figures.of(org.precedent.engine.evaluate.ReportFiles
        .readJson(dir.latestReport()));
    candidateAlone = alone(dir, "v-0003", parsed);
    evaluateOutput.lines().filter(l -> l.startsWith("v-0003 (candidate)") || l.startsWith("  "))
        .forEach(l -> System.err.println("comparison fixture | " + l));
    System.err.printf(java.util.Locale.ROOT, "comparison fixture: %d held-out tickets, two "
        + "versions evaluated and one measured alone in %.1f s%n", HELD_OUT,
        (System.nanoTime() - start) / 1e9);
  }

  @AfterAll
  static void removed() {
    TrainedData.delete(copy);
  }

  private static VersionComparison.Figures alone(DataDir dir, String version,
      Ingestor.ParsedExport parsed) throws Exception {
    try (InForce opened = InForce.open(dir, version)) {
      return VersionComparison.Figures.of(HeldOutEvaluation.measure(opened, parsed, "alone",
          TARGET, Progress.silent()));
    }
  }

  /** The header and the first {@code n} records of a CSV export. */
  static void firstRows(Path from, Path to, int n) throws Exception {
    CSVFormat format = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).build();
    try (Reader in = Files.newBufferedReader(from, StandardCharsets.UTF_8);
        CSVParser parser = CSVParser.parse(in, format);
        Writer w = Files.newBufferedWriter(to, StandardCharsets.UTF_8);
        CSVPrinter printer = new CSVPrinter(w, CSVFormat.RFC4180)) {
      printer.printRecord(parser.getHeaderNames());
      int i = 0;
      for (CSVRecord r : parser) {
        if (i++ == n) {
          break;
        }
        printer.printRecord(r.toList());
      }
    }
  }

  /**
   * A copy of v-0001 whose every system's Platt map is flat at 0.5 (A = B = 0), with a manifest
   * made for its files as the store makes one: a valid version, and a worse one.
   */
  static void flatVersion(Path data, String name) throws Exception {
    Path dir = TestCopies.recalibrated(data, name, 0.0, 0.0);
    VersionFixtures.remanifest(dir);
    new ModelStore(data.resolve("models")).verify(name);
  }

  private static VersionComparison kept(Path data) throws Exception {
    return VersionComparisons.read(new ModelStore(data.resolve("models")), "v-0003", "v-0001")
        .orElseThrow();
  }

  private static String active() {
    return service.http().get("/api/v1/models", Caller.MANAGER).json().get("active").asText();
  }

  private static int audited() {
    return service.http().get("/api/v1/models", Caller.MANAGER).json().get("activations").size();
  }

  @Test
  void theComparisonHoldsWhatEachVersionMeasuresOnItsOwn() throws Exception {
    VersionComparison c = kept(copy);
    // The check from outside the comparison: engine.evaluate's figures of each version alone.
    assertEquals(inForceAlone, c.inForceFigures());
    assertEquals(candidateAlone, c.candidateFigures());
    assertTrue(c.inForceFigures().coverage() > 0, "the version in force gets a guaranteed "
        + "threshold at " + TARGET + ": " + c.inForceFigures());
    assertEquals(0.0, c.candidateFigures().coverage());
    assertEquals(null, c.candidateFigures().threshold());
    // Same ranking, other calibration: the top-1 is the same, the coverage is not.
    assertEquals(c.inForceFigures().top1(), c.candidateFigures().top1());
    assertEquals(0.0, c.difference().top1(), 1e-12);
    assertEquals(-c.inForceFigures().coverage(), c.difference().coverage(), 1e-12);
    assertTrue(c.candidateWorse());
    assertEquals(HELD_OUT, c.tickets());
    assertEquals(TARGET, c.targetPrecision());
    assertEquals(AtomicFiles.sha256(heldOut), c.heldOutSha256());
    Path file = VersionComparisons.file(new ModelStore(copy.resolve("models")), "v-0003",
        "v-0001");
    if (Files.getFileStore(file).supportsFileAttributeView("posix")) {
      assertEquals("r--------", java.nio.file.attribute.PosixFilePermissions.toString(
          Files.getPosixFilePermissions(file)));
    }
    // evaluate prints both side by side, and what an activation would need.
    assertTrue(evaluateOutput.contains("v-0003 (candidate) beside v-0001 (in force) on the same "
        + HELD_OUT + " held-out tickets"), evaluateOutput);
    assertTrue(evaluateOutput.contains("needs an acknowledgement"), evaluateOutput);
    // And the approval gate both ways at the guaranteed threshold: nothing is approved yet, so
    // the gate sends nothing, and approving the drafted answers adds every reply.
    var report = org.precedent.engine.evaluate.ReportFiles.readJson(new DataDir(copy)
        .latestReport());
    double t = c.inForceFigures().threshold();
    long replied = report.outcomes().stream().filter(o -> o.replied(t)).count();
    String share = String.format(java.util.Locale.ROOT, "%.1f%%", 100.0 * replied / HELD_OUT);
    assertTrue(evaluateOutput.contains("without the approval gate: " + share + " answered"),
        evaluateOutput);
    assertTrue(evaluateOutput.contains("with the approval gate (0 approved answers): 0.0% "
        + "answered, n/a right"), evaluateOutput);
    assertTrue(evaluateOutput.contains(String.format(java.util.Locale.ROOT, "would add %.1f "
        + "points of coverage", 100.0 * replied / HELD_OUT)), evaluateOutput);
    // The comparison file lies outside the version's manifest, which still checks out.
    new ModelStore(copy.resolve("models")).verify("v-0003");
  }

  @Test
  void evaluateApplyGoesThroughTheThresholdAudit() throws Exception {
    DataDir dir = new DataDir(copy);
    double guaranteed = kept(copy).inForceFigures().threshold();
    assertEquals(guaranteed, InForce.readThresholds(dir).global());
    try (Connection c = DriverManager.getConnection("jdbc:h2:file:" + dir.serviceDatabase(),
        "sa", "");
        ResultSet rs = c.createStatement().executeQuery("SELECT changed_by, new_value, reason "
            + "FROM threshold_change ORDER BY id")) {
      assertTrue(rs.next(), "an audit row");
      assertTrue(rs.getString(1).endsWith("(command line)"), rs.getString(1));
      assertTrue(rs.getString(2).startsWith("global=" + org.precedent.engine.measure
          .ThresholdDecimals.of(guaranteed, 4)), rs.getString(2));
      assertTrue(rs.getString(3).startsWith("guaranteed threshold of the evaluation"),
          rs.getString(3));
      assertFalse(rs.next(), "one change");
    }
  }

  @Test
  void aWorseCandidateIsRefusedWithTheComparisonUnlessAcknowledgedAndTheAuditKeepsIt()
      throws Exception {
    int before = audited();
    Reply shown = service.http().get("/api/v1/models/v-0003/comparison", Caller.MANAGER);
    assertEquals(200, shown.status(), shown.raw().body());
    assertTrue(shown.json().get("needsAcknowledgement").asBoolean());
    Reply refused = service.http().post("/api/v1/models/v-0003/activation",
        Map.of("reason", "newer is better"), Caller.MANAGER);
    assertEquals(409, refused.status(), refused.raw().body());
    assertEquals("application/problem+json", refused.header("Content-Type"));
    var comparison = refused.json().get("comparison");
    assertEquals(kept(copy).inForceFigures().coverage(),
        comparison.get("inForceFigures").get("coverage").asDouble());
    assertEquals(0.0, comparison.get("candidateFigures").get("coverage").asDouble());
    assertTrue(refused.json().get("detail").asText().contains("points fewer"),
        refused.raw().body());
    assertEquals("v-0001", active());
    assertEquals(before, audited());

    Reply taken = service.http().post("/api/v1/models/v-0003/activation",
        Map.of("reason", "kept for its wording, coverage accepted", "acknowledged", true),
        Caller.MANAGER);
    assertEquals(200, taken.status(), taken.raw().body());
    assertEquals("v-0003", active());
    var row = service.http().get("/api/v1/models", Caller.MANAGER).json().get("activations")
        .get(0);
    assertTrue(row.get("acknowledged").asBoolean());
    assertEquals("v-0003", row.get("comparison").get("candidate").asText());
    assertEquals(kept(copy).difference().coverage(),
        row.get("comparison").get("difference").get("coverage").asDouble());
    Reply back = service.http().post("/api/v1/models/rollback", Map.of("reason", "undo"),
        Caller.MANAGER);
    assertEquals(200, back.status(), back.raw().body());
    assertEquals("v-0001", active());
  }

  @Test
  void anAcknowledgementWithoutAReasonIsRefused() {
    for (Object body : List.of(Map.of("acknowledged", true), Map.of("reason", "  ",
        "acknowledged", true))) {
      Reply r = service.http().post("/api/v1/models/v-0003/activation", body, Caller.MANAGER);
      assertEquals(400, r.status(), r.raw().body());
      assertEquals("reason", r.json().get("errors").get(0).get("field").asText());
    }
    assertEquals("v-0001", active());
  }

  @Test
  void anUnknownVersionIs404AndAnUncomparedOneNeedsAnAcknowledgement() {
    assertEquals(404, service.http().post("/api/v1/models/v-0077/activation",
        Map.of("reason", "x", "acknowledged", true), Caller.MANAGER).status());
    assertEquals(404, service.http().get("/api/v1/models/v-0077/comparison", Caller.MANAGER)
        .status());
    Reply r = service.http().post("/api/v1/models/v-0002/activation", Map.of("reason", "x"),
        Caller.MANAGER);
    assertEquals(409, r.status(), r.raw().body());
    assertTrue(r.json().get("detail").asText().contains("has not been compared with v-0001"),
        r.raw().body());
    // A problem detail leaves out a property that is null: there is no comparison to show.
    assertTrue(r.json().path("comparison").isMissingNode() || r.json().get("comparison").isNull(),
        r.raw().body());
    assertEquals("v-0001", active());
  }

  @Test
  void aTamperedComparisonIsRefusedEvenWhenAcknowledged() throws Exception {
    Path file = VersionComparisons.file(new ModelStore(service.data().resolve("models")),
        "v-0003", "v-0001");
    byte[] original = Files.readAllBytes(file);
    try {
      file.toFile().setWritable(true, true);
      // The candidate made to look as good as the version in force.
      String edited = new String(original, StandardCharsets.UTF_8).replace(
          "\"candidateWorse\" : true", "\"candidateWorse\" : false");
      assertFalse(edited.equals(new String(original, StandardCharsets.UTF_8)));
      Files.writeString(file, edited);
      Reply r = service.http().post("/api/v1/models/v-0003/activation",
          Map.of("reason", "looks fine", "acknowledged", true), Caller.MANAGER);
      assertEquals(422, r.status(), r.raw().body());
      String detail = r.json().get("detail").asText();
      assertTrue(detail.contains("comparisons/v-0001.json") && detail.contains("changed after"),
          detail);
      assertEquals("v-0001", active());
    } finally {
      Files.write(file, original);
    }
  }

  @Test
  void aComparisonOverAnotherKnowledgeGenerationNoLongerHolds() throws Exception {
    Path knowledge = service.data().resolve("knowledge");
    Path current = knowledge.resolve("CURRENT");
    String was = Files.readString(current).strip();
    String next = "gen-999999";
    TrainedData.copyTree(knowledge.resolve(was), knowledge.resolve(next));
    try {
      Files.writeString(current, next + "\n");
      Reply r = service.http().post("/api/v1/models/v-0003/activation",
          Map.of("reason", "newer"), Caller.MANAGER);
      assertEquals(409, r.status(), r.raw().body());
      String detail = r.json().get("detail").asText();
      assertTrue(detail.contains("over knowledge " + was + ", but " + next + " is in force"),
          detail);
      assertEquals("v-0001", active());
    } finally {
      Files.writeString(current, was + "\n");
      TrainedData.delete(knowledge.resolve(next));
    }
  }

  @Test
  void theCommandLineShowsTheComparisonRefusesAndWithAnAcknowledgementRecordsIt()
      throws Exception {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    String[] activate = {"--data", copy.toString(), "activate", "v-0003", "--reason",
        "the newest"};
    assertEquals(1, PrecedentCommand.run(new PrintWriter(out, true), new PrintWriter(err, true),
        activate));
    assertTrue(out.toString().contains("coverage at 85.0% precision"), out.toString());
    assertTrue(err.toString().contains("points fewer") && err.toString().contains(
        "--acknowledge"), err.toString());
    assertEquals("v-0001", Files.readString(copy.resolve("models/ACTIVE")).strip());
    out.getBuffer().setLength(0);
    String[] blank = {"--data", copy.toString(), "activate", "v-0003", "--reason", " ",
        "--acknowledge"};
    assertEquals(1, PrecedentCommand.run(new PrintWriter(out, true), new PrintWriter(err, true),
        blank));
    assertEquals(1, PrecedentCommand.run(new PrintWriter(out, true), new PrintWriter(err, true),
        "--data", copy.toString(), "activate", "v-0077", "--reason", "x", "--acknowledge"));
    assertTrue(err.toString().contains("no reranker version v-0077"), err.toString());
    String[] acknowledged = {"--data", copy.toString(), "activate", "v-0003", "--reason",
        "the newest, knowingly", "--acknowledge"};
    assertEquals(0, PrecedentCommand.run(new PrintWriter(out, true), new PrintWriter(err, true),
        acknowledged), err.toString());
    assertTrue(out.toString().contains("model v-0003 is in force (was v-0001)"), out.toString());
    assertEquals("v-0003", Files.readString(copy.resolve("models/ACTIVE")).strip());
    // Again: already in force, nothing recorded.
    assertEquals(0, PrecedentCommand.run(new PrintWriter(out, true), new PrintWriter(err, true),
        acknowledged));
    assertTrue(out.toString().contains("model v-0003 is already in force"), out.toString());
    DataDir dir = new DataDir(copy);
    try (Connection c = DriverManager.getConnection("jdbc:h2:file:" + dir.serviceDatabase(),
        "sa", "");
        ResultSet rs = c.createStatement().executeQuery("SELECT old_version, new_version, "
            + "reason, comparison, acknowledged FROM model_activation ORDER BY id")) {
      assertTrue(rs.next());
      assertEquals("v-0001", rs.getString(1));
      assertEquals("v-0003", rs.getString(2));
      assertEquals("the newest, knowingly", rs.getString(3));
      assertEquals(VersionComparisons.compact(kept(copy)), rs.getString(4));
      assertTrue(rs.getBoolean(5));
      assertFalse(rs.next());
    }
    // Back again, for the other tests of this copy.
    new ModelStore(copy.resolve("models")).activate("v-0001");
  }

  /**
   * The first version goes in force at once: every test of the service stands on it (TrainedData
   * trains into an empty directory and serves what that made active). A later one waits.
   */
  @Test
  void aNewVersionIsACandidateOnceOneIsInForce() throws Exception {
    Path data = TrainedData.copy();
    try {
      assertEquals("v-0001", Files.readString(data.resolve("models/ACTIVE")).strip());
      DataDir dir = new DataDir(data);
      Knowledge knowledge = Knowledge.open(dir).orElseThrow();
      RerankerConfig micro = RerankerConfig.defaults().withSizes(8, 16).withEpochs(1, 1)
          .withMaxTokens(12, 8);
      var candidate = new TeamModelTrainer(dir, micro).train(knowledge,
          TeamModelTrainer.rerankerPairs(knowledge).subList(0, 20),
          TeamModelTrainer.fusionQuestions(knowledge).subList(0, 30), false);
      assertFalse(candidate.activated());
      assertEquals("v-0003", candidate.version());
      assertEquals("v-0001", Files.readString(data.resolve("models/ACTIVE")).strip());
    } finally {
      TrainedData.delete(data);
    }
  }

  @Test
  void aComparisonFileNamingOtherVersionsIsRefused() throws Exception {
    ModelStore store = new ModelStore(copy.resolve("models"));
    Path misplaced = VersionComparisons.file(store, "v-0002", "v-0001");
    Files.createDirectories(misplaced.getParent());
    Files.copy(VersionComparisons.file(store, "v-0003", "v-0001"), misplaced);
    try {
      ModelLoadException e = assertThrows(ModelLoadException.class,
          () -> VersionComparisons.read(store, "v-0002", "v-0001"));
      assertTrue(e.getMessage().contains("compares v-0003 with v-0001"), e.getMessage());
      assertNotNull(e.getMessage());
    } finally {
      TrainedData.delete(misplaced.getParent());
    }
  }
}
