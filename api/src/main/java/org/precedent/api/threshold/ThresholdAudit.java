package org.precedent.api.threshold;

import java.io.IOException;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.Instant;
import java.util.TreeMap;
import org.precedent.api.system.AuditColumns;
import org.precedent.api.system.CommandLineDatabase;
import org.precedent.api.system.ReplicaSync;
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
 * the demo) come here, and are refused while the service holds the database, so that no change
 * is ever made behind the audit's back.
 */
public final class ThresholdAudit {
  private static final String INSERT = "INSERT INTO threshold_change (changed_by, changed_at, "
      + "old_value, new_value, reason) VALUES (?, ?, ?, ?, ?)";

  private ThresholdAudit() {}

  /**
   * Puts {@code next} in force in {@code dir} and records the change in the service's database:
   * the row is written in a transaction that commits only once the thresholds file is in place,
   * and the file is restored if the commit fails.
   *
   * @param who    who made the change, as the audit shows it
   * @param reason why, as the audit shows it
   * @throws IOException when the database cannot be opened (the service running on the same data
   *                     directory, or a damaged file) or written; nothing is changed then
   */
  public static void applyFromCommandLine(DataDir dir, Thresholds next, String who,
      String reason) throws IOException {
    Thresholds old = InForce.readThresholds(dir);
    // The database holds the audit: private to its owner from the start, as the service keeps it.
    try (Connection c = CommandLineDatabase.open(dir)) {
      // The column widths as the migrations set them, read from the database as the service does.
      AuditColumns audit = new AuditColumns(new JdbcTemplate(new SingleConnectionDataSource(c,
          true)));
      int reasonWidth = audit.width("threshold_change", "reason");
      if (reason.length() > reasonWidth) {
        throw new IOException("--reason: at most " + reasonWidth + " characters (the audit "
            + "record keeps no more), got " + reason.length() + "; the threshold in force is "
            + "unchanged");
      }
      c.setAutoCommit(false);
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
      // In the same transaction: the service's next start reads the shared row, not the file.
      ReplicaSync.publishThresholds(new JdbcTemplate(new SingleConnectionDataSource(c, true)),
          next);
      InForce.writeThresholds(dir, next);
      try {
        c.commit();
      } catch (SQLException e) {
        InForce.writeThresholds(dir, old);
        throw e;
      }
    } catch (SQLException | org.springframework.dao.DataAccessException e) {
      if (e instanceof SQLException sql && CommandLineDatabase.heldByService(sql)) {
        throw new IOException("the service is running on " + dir.root() + " (its database "
            + dir.serviceDatabase() + ".mv.db is in use): change the threshold on its manager "
            + "page, or stop it first; the threshold in force is unchanged", e);
      }
      throw new IOException(dir.serviceDatabase() + ".mv.db: the threshold change could not be "
          + "recorded (" + e.getMessage() + "); the threshold in force is unchanged", e);
    }
    AtomicFiles.makePrivate(dir.serviceDatabase().getParent());
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
