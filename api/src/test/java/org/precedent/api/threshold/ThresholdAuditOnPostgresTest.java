package org.precedent.api.threshold;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.RegisterExtension;
import org.precedent.api.system.ReplicaSync;
import org.precedent.api.system.ServiceDatabase;
import org.precedent.api.system.ServiceSchema;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.Http.Reply;
import org.precedent.api.testing.PostgresForClass;
import org.precedent.api.testing.RunningService;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.decide.Thresholds;
import org.precedent.knowledge.store.DataDir;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * The command line's threshold change ({@code evaluate --apply}) on a service set to use
 * PostgreSQL: recorded in that database, audit row and shared row, where a running replica reads
 * it and puts it in force; the data directory's H2 file is not made.
 */
class ThresholdAuditOnPostgresTest {
  @RegisterExtension
  static final PostgresForClass postgres = new PostgresForClass();
  static final long POLL_MS = 200;

  @Test
  void theChangeReachesThePostgresTheServiceUsesAndARunningReplicaFollows() throws Exception {
    ServiceSchema.migrate(postgres.dataSource());
    postgres.reset();
    List<String> settings = List.of("--spring.datasource.url=" + postgres.url(),
        "--spring.datasource.username=postgres");
    try (RunningService replica = RunningService.start(settings.get(0), settings.get(1),
        "--precedent.shared.poll-ms=" + POLL_MS)) {
      DataDir dir = new DataDir(replica.data());
      Reply set = replica.http().put("/api/v1/threshold", Map.of("global", 0.9, "perCategory",
          Map.of("billing", 0.97), "reason", "billing needs care"), Caller.MANAGER);
      assertEquals(200, set.status(), set.raw().body());

      ServiceDatabase db = ServiceDatabase.of(dir.root(), settings);
      assertFalse(db.isH2());
      ThresholdAudit.applyFromCommandLine(dir, db, old -> new Thresholds(0.42,
          old.perCategory()), "sam (command line)", "guaranteed threshold of the evaluation");

      JdbcTemplate pg = new JdbcTemplate(postgres.dataSource());
      assertEquals(List.of("sam (command line) | global=0.9000; billing=0.9700 | "
          + "global=0.4200; billing=0.9700"), pg.queryForList("SELECT changed_by || ' | ' || "
          + "old_value || ' | ' || new_value FROM threshold_change WHERE changed_by LIKE 'sam%'",
          String.class));
      Thresholds changed = new Thresholds(0.42, Map.of("billing", 0.97));
      assertEquals(changed, ReplicaSync.sharedThresholds(pg).orElseThrow());
      assertEquals(changed, InForce.readThresholds(dir));
      assertFalse(Files.exists(Path.of(dir.serviceDatabase() + ".mv.db")),
          "nothing written to the data directory's H2 file");
      // The running replica puts it in force at its next read of the shared row.
      long start = System.nanoTime();
      double global = -1;
      while ((System.nanoTime() - start) / 1_000_000 < 20 * POLL_MS && global != 0.42) {
        global = replica.http().get("/api/v1/threshold", Caller.MANAGER).json().get("global")
            .asDouble();
        Thread.sleep(20);
      }
      assertEquals(0.42, global, 1e-12, "in force on the running replica");
    }
  }

  @Test
  void theServicesOwnDefaultIsTheDataDirectorysH2File() {
    Path data = Path.of("some", "data").toAbsolutePath();
    ServiceDatabase db = ServiceDatabase.of(data, List.of());
    // As application.properties sets it, for the place DataDir names (unless the environment
    // running this test points the service elsewhere).
    if (System.getenv("SPRING_DATASOURCE_URL") == null
        && System.getProperty("spring.datasource.url") == null) {
      assertEquals("jdbc:h2:file:" + new DataDir(data).serviceDatabase() + ";WRITE_DELAY=0",
          db.url());
      assertTrue(db.isH2());
    }
    assertFalse(db.toString().contains("password"));
    ServiceDatabase given = ServiceDatabase.of(data, List.of(
        "--spring.datasource.url=jdbc:postgresql://db.example:5432/precedent?password=secret",
        "--spring.datasource.username=precedent", "--spring.datasource.password=secret"));
    assertEquals("precedent", given.user());
    assertEquals("secret", given.password());
    assertEquals("jdbc:postgresql://db.example:5432/precedent", given.shown());
    assertFalse(given.toString().contains("secret"), given.toString());
  }

  @Test
  void evaluateTakesSettingsOnlyForApply() {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int status = org.precedent.api.cli.PrecedentCommand.run(new PrintWriter(out, true),
        new PrintWriter(err, true), "evaluate", "heldout.csv", "--",
        "--spring.datasource.url=" + postgres.url());
    assertEquals(2, status, err.toString());
    assertTrue(err.toString().contains("only the service's settings for --apply"),
        err.toString());
  }
}
