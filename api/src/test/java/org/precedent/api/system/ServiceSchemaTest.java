package org.precedent.api.system;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import javax.sql.DataSource;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.RegisterExtension;
import org.precedent.api.testing.PostgresForClass;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.jdbc.datasource.DriverManagerDataSource;

/** The same migrations on H2 (the embedded default) and on a real PostgreSQL server. */
class ServiceSchemaTest {
  @RegisterExtension
  static final PostgresForClass postgres = new PostgresForClass();

  private static final String[][] AUDIT_COLUMNS = {
      {"threshold_change", "reason"}, {"threshold_change", "old_value"},
      {"threshold_change", "new_value"}, {"model_activation", "reason"},
      {"model_activation", "comparison"},
      {"suggestion_feedback", "final_text"}, {"suggestion_feedback", "suggested_text"},
      {"queue_ticket", "question"}};

  private static DataSource h2() {
    return new DriverManagerDataSource("jdbc:h2:mem:schema" + System.nanoTime()
        + ";DB_CLOSE_DELAY=-1", "sa", "");
  }

  @BeforeEach
  void migrated() {
    ServiceSchema.migrate(postgres.dataSource());
    postgres.reset();
  }

  @Test
  void bothDatabasesGetTheSameColumnWidths() {
    DataSource h2 = h2();
    ServiceSchema.migrate(h2);
    AuditColumns onH2 = new AuditColumns(new JdbcTemplate(h2));
    AuditColumns onPostgres = new AuditColumns(new JdbcTemplate(postgres.dataSource()));
    for (String[] c : AUDIT_COLUMNS) {
      assertEquals(onH2.width(c[0], c[1]), onPostgres.width(c[0], c[1]), c[0] + "." + c[1]);
    }
    // The widths V1__init.sql states (threshold_change.reason VARCHAR(2000)).
    assertEquals(2000, onPostgres.width("threshold_change", "reason"));
    // V4__activation_comparison.sql: model_activation.comparison VARCHAR(4000).
    assertEquals(4000, onPostgres.width("model_activation", "comparison"));
  }

  @Test
  void migratingAgainChangesNothing() {
    DataSource h2 = h2();
    for (DataSource db : List.of(h2, postgres.dataSource())) {
      ServiceSchema.migrate(db);
      ServiceSchema.migrate(db);
      JdbcTemplate t = new JdbcTemplate(db);
      // Each script applied once: V1 to V5 (an empty database is not baselined).
      assertEquals(List.of("1", "2", "3", "4", "5"), t.queryForList("SELECT \"version\" FROM \"flyway_schema_history\""
          + " WHERE \"type\" = 'SQL' ORDER BY \"installed_rank\"", String.class));
    }
  }

  /** V4 on a row written before it: no comparison, not acknowledged, on both databases. */
  @Test
  void anActivationRecordedBeforeV4HasNoComparisonAndNoAcknowledgement() {
    DataSource h2 = h2();
    // PostgreSQL, migrated by @BeforeEach: emptied, so that both start at V3.
    new JdbcTemplate(postgres.dataSource()).execute("DROP SCHEMA public CASCADE; "
        + "CREATE SCHEMA public");
    for (DataSource db : List.of(h2, postgres.dataSource())) {
      org.flywaydb.core.Flyway.configure().dataSource(db).locations("classpath:db/migration")
          .target("3").load().migrate();
    }
    for (DataSource db : List.of(h2, postgres.dataSource())) {
      JdbcTemplate t = new JdbcTemplate(db);
      t.update("INSERT INTO model_activation (activated_by, activated_at, old_version, "
          + "new_version, reason) VALUES ('sam', CURRENT_TIMESTAMP, 'v-0001', 'v-0002', 'old')");
      ServiceSchema.migrate(db);
      assertEquals(List.of("null false"), t.query("SELECT comparison, acknowledged FROM "
          + "model_activation", (rs, n) -> rs.getString(1) + " " + rs.getBoolean(2)));
    }
  }

  /** The claim the queue's replicas share a database by: locked rows are passed over. */
  @Test
  void bothDatabasesSkipLockedRows() throws Exception {
    DataSource h2 = h2();
    ServiceSchema.migrate(h2);
    for (DataSource db : List.of(h2, postgres.dataSource())) {
      JdbcTemplate t = new JdbcTemplate(db);
      for (int i = 1; i <= 3; i++) {
        t.update("INSERT INTO queue_ticket (ticket_id, question, status, submitted_by,"
            + " submitted_at) VALUES (?, 'q', 'QUEUED', 'test', CURRENT_TIMESTAMP)", "t" + i);
      }
      String claim = "SELECT ticket_id FROM queue_ticket WHERE status = 'QUEUED' ORDER BY seq"
          + " LIMIT 2 FOR UPDATE SKIP LOCKED";
      try (var first = db.getConnection(); var second = db.getConnection()) {
        first.setAutoCommit(false);
        second.setAutoCommit(false);
        List<String> a = ids(first, claim);
        List<String> b = ids(second, claim);
        assertEquals(List.of("t1", "t2"), a, db.toString());
        if (db == h2) {
          // H2 2.3 locks every row its query reads before the limit is applied (measured here):
          // a second claimer gets none of them, never the same ones. Several replicas need a
          // shared server database in any case.
          assertEquals(List.of(), b, "H2");
        } else {
          assertEquals(List.of("t3"), b, "PostgreSQL");
        }
        first.rollback();
        second.rollback();
      }
    }
  }

  private static List<String> ids(java.sql.Connection c, String sql) throws Exception {
    List<String> out = new java.util.ArrayList<>();
    try (var s = c.createStatement(); var rs = s.executeQuery(sql)) {
      while (rs.next()) {
        out.add(rs.getString(1));
      }
    }
    return out;
  }
}
