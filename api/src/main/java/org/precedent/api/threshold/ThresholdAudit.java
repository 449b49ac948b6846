package org.precedent.api.threshold;

import java.io.IOException;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.Instant;
import java.util.TreeMap;
import java.util.function.UnaryOperator;
import org.precedent.api.system.AuditColumns;
import org.precedent.api.system.CommandLineDatabase;
import org.precedent.api.system.ReplicaSync;
import org.precedent.api.system.ServiceDatabase;
import org.precedent.api.system.ServiceSchema;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.decide.Thresholds;
import org.precedent.engine.measure.ThresholdDecimals;
import org.precedent.knowledge.io.AtomicFiles;
import org.precedent.knowledge.store.DataDir;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.jdbc.datasource.SingleConnectionDataSource;

/**
 * The audit of threshold changes: one row per change (who, when, before, after, why) in the
 * service's database, whichever door the change came through. The manager page's changes go
 * through the service ({@link ThresholdController}); the command line's ({@code evaluate --apply},
 * the demo) come here, to the database the service is configured with ({@link ServiceDatabase}),
 * and on the data directory's H2 file are refused while the service holds it, so that no change
 * is ever made behind the audit's back.
 */
public final class ThresholdAudit {
  private static final String INSERT = "INSERT INTO threshold_change (changed_by, changed_at, "
      + "old_value, new_value, reason) VALUES (?, ?, ?, ?, ?)";

  private ThresholdAudit() {}

  /**
   * Puts {@code next} in force in {@code dir} and records the change in the data directory's own
   * H2 database, as {@link #applyFromCommandLine(DataDir, ServiceDatabase, UnaryOperator, String,
   * String)} does.
   */
  public static void applyFromCommandLine(DataDir dir, Thresholds next, String who,
      String reason) throws IOException {
    applyFromCommandLine(dir, new ServiceDatabase("jdbc:h2:file:" + dir.serviceDatabase()
        + ";WRITE_DELAY=0", "sa", ""), old -> next, who, reason);
  }

  /**
   * Puts {@code change} of the thresholds in force in {@code dir} and records it in the service's
   * database {@code db}: the audit row and the shared row every replica reads ({@code
   * shared_in_force}) are written in a transaction that commits only once the thresholds file is
   * in place, and the file is restored if the commit fails. On H2 (the data directory's file) the
   * service must be stopped, since the file admits one process; on a database server the
   * replicas may run, and each puts the change in force at its next read of the shared row
   * ({@code precedent.shared.poll-ms}). What is in force before the change is the shared row
   * where there is one (the replicas' truth), else the thresholds file.
   *
   * @param who    who made the change, as the audit shows it
   * @param reason why, as the audit shows it
   * @throws IOException when the database cannot be opened (the service running on the same data
   *                     directory's H2 file, a damaged file, a server that cannot be reached) or
   *                     written; nothing is changed then
   */
  public static void applyFromCommandLine(DataDir dir, ServiceDatabase db,
      UnaryOperator<Thresholds> change, String who, String reason) throws IOException {
    Thresholds inFile = InForce.readThresholds(dir);
    String where = db.isH2() ? dir.serviceDatabase() + ".mv.db" : db.shown();
    if (db.isH2()) {
      // The database holds the audit: private to its owner from the start, as the service keeps
      // it.
      AtomicFiles.createPrivateDirectories(dir.serviceDatabase().getParent());
    }
    try (Connection c = DriverManager.getConnection(db.url(), db.user(), db.password())) {
      createTables(c);
      JdbcTemplate jdbc = new JdbcTemplate(new SingleConnectionDataSource(c, true));
      // The column widths as the migrations set them, read from the database as the service does.
      AuditColumns audit = new AuditColumns(jdbc);
      int reasonWidth = audit.width("threshold_change", "reason");
      if (reason.length() > reasonWidth) {
        throw new IOException("--reason: at most " + reasonWidth + " characters (the audit "
            + "record keeps no more), got " + reason.length() + "; the threshold in force is "
            + "unchanged");
      }
      c.setAutoCommit(false);
      Thresholds old = ReplicaSync.sharedThresholds(jdbc).orElse(inFile);
      Thresholds next = change.apply(old);
      try (PreparedStatement insert = c.prepareStatement(INSERT)) {
        insert.setString(1, who);
        insert.setTimestamp(2, Timestamp.from(Instant.now()));
        // Set by hand or by an earlier release, the old thresholds may be longer: cut, as the
        // service cuts them; the new ones are the old categories with a new global value.
        insert.setString(3, abbreviate(describe(old), audit.width("threshold_change",
            "old_value")));
        insert.setString(4, abbreviate(describe(next), audit.width("threshold_change",
            "new_value")));
        insert.setString(5, reason);
        insert.executeUpdate();
      }
      // In the same transaction: the replicas, and the service's next start, read the shared
      // row, not the file.
      ReplicaSync.publishThresholds(jdbc, next);
      InForce.writeThresholds(dir, next);
      try {
        c.commit();
      } catch (SQLException e) {
        InForce.writeThresholds(dir, inFile);
        throw e;
      }
    } catch (SQLException | org.springframework.dao.DataAccessException e) {
      if (e instanceof SQLException sql && CommandLineDatabase.heldByService(sql)) {
        throw new IOException("the service is running on " + dir.root() + " (its database "
            + where + " is in use): change the threshold on its manager page, or stop it first; "
            + "the threshold in force is unchanged", e);
      }
      throw new IOException(where + ": the threshold change could not be recorded ("
          + e.getMessage() + "); the threshold in force is unchanged", e);
    }
    if (db.isH2()) {
      AtomicFiles.makePrivate(dir.serviceDatabase().getParent());
    }
  }

  /** The service's own schema, so that a change made before the service ever ran is kept too. */
  private static void createTables(Connection c) {
    // The same migrations as the service's own start runs.
    ServiceSchema.migrate(new SingleConnectionDataSource(c, true));
  }

  /** Every digit of each threshold, at least four decimals: the audit names the rule exactly. */
  static String describe(Thresholds t) {
    StringBuilder s = new StringBuilder("global=" + ThresholdDecimals.of(t.global(), 4));
    new TreeMap<>(t.perCategory()).forEach((c, v) ->
        s.append("; ").append(quoted(c)).append('=').append(ThresholdDecimals.of(v, 4)));
    return s.toString();
  }

  /** A name that holds this record's own separators is quoted, so the record reads one way. */
  private static String quoted(String category) {
    if (category.indexOf(';') < 0 && category.indexOf('=') < 0 && category.indexOf('"') < 0) {
      return category;
    }
    return '"' + category.replace("\\", "\\\\").replace("\"", "\\\"") + '"';
  }

  static String abbreviate(String text, int width) {
    String more = " ... (cut to fit the audit record)";
    return text.length() <= width ? text : text.substring(0, width - more.length()) + more;
  }
}
