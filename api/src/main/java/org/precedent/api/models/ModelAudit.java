package org.precedent.api.models;

import java.io.IOException;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.Instant;
import org.precedent.api.system.AuditColumns;
import org.precedent.api.system.ReplicaSync;
import org.precedent.api.system.ServiceSchema;
import org.precedent.engine.evaluate.VersionComparisons;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.knowledge.io.AtomicFiles;
import org.precedent.knowledge.store.DataDir;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.jdbc.datasource.SingleConnectionDataSource;

/**
 * Model activations from the command line ({@code activate}, {@code train --activate}, the
 * demo): the same rule as the service's ({@link Activations}) and a row in the same audit table
 * ({@code model_activation}) in the service's database file, committed only once {@code ACTIVE}
 * names the version; refused while the service holds the database, so that no version goes in
 * force behind the audit's back.
 */
public final class ModelAudit {
  /** H2's DATABASE_ALREADY_OPEN_1 (org.h2.api.ErrorCode): another process holds the file. */
  private static final int DATABASE_ALREADY_OPEN = 90020;
  static final String INSERT = "INSERT INTO model_activation (activated_by, activated_at, "
      + "old_version, new_version, reason, comparison, acknowledged) VALUES (?, ?, ?, ?, ?, ?, ?)";

  private ModelAudit() {}

  /** An activation refused for want of an acknowledgement; the verdict says why. */
  public static final class Refused extends IOException {
    private final transient Activations.Verdict verdict;

    Refused(Activations.Verdict verdict) {
      super("not activated: " + verdict.objection() + ". To activate it all the same, "
          + "acknowledge it (--acknowledge) with a reason; the version in force is unchanged");
      this.verdict = verdict;
    }

    public Activations.Verdict verdict() {
      return verdict;
    }
  }

  /**
   * Puts {@code version} in force in {@code dir} and records it, with its comparison, in the
   * audit.
   *
   * @param acknowledged the caller accepts a version that is worse, not compared, or compared on
   *                     other knowledge or files
   * @return the verdict shown
   * @throws Refused     when the version needs an acknowledgement and has none
   * @throws IOException when the database cannot be opened or written; nothing changes then
   */
  public static Activations.Verdict activateFromCommandLine(DataDir dir, String version,
      String who, String reason, boolean acknowledged) throws IOException {
    ModelStore store = new ModelStore(dir.models());
    String before = store.activeVersion().orElse(null);
    Activations.Verdict verdict = Activations.judge(dir, before, version);
    if (verdict.needsAcknowledgement() && !acknowledged) {
      throw new Refused(verdict);
    }
    if (version.equals(before)) {
      // Nothing changes, so nothing is recorded.
      return verdict;
    }
    AtomicFiles.createPrivateDirectories(dir.serviceDatabase().getParent());
    String url = "jdbc:h2:file:" + dir.serviceDatabase() + ";WRITE_DELAY=0";
    try (Connection c = DriverManager.getConnection(url, "sa", "")) {
      ServiceSchema.migrate(new SingleConnectionDataSource(c, true));
      JdbcTemplate db = new JdbcTemplate(new SingleConnectionDataSource(c, true));
      int width = new AuditColumns(db).width("model_activation", "reason");
      if (reason.strip().length() > width) {
        throw new IOException("--reason: at most " + width + " characters (the audit record "
            + "keeps no more), got " + reason.strip().length() + "; the version in force is "
            + "unchanged");
      }
      c.setAutoCommit(false);
      db.update(INSERT, who, Timestamp.from(Instant.now()), before == null ? "" : before,
          version, reason.strip(), verdict.comparison() == null ? null
              : VersionComparisons.compact(verdict.comparison()),
          verdict.needsAcknowledgement());
      // In the same transaction: the service's next start reads the shared row, not ACTIVE.
      ReplicaSync.publishVersion(db, version);
      store.activate(version);
      try {
        c.commit();
      } catch (SQLException e) {
        if (before != null) {
          store.activate(before);
        }
        throw e;
      }
    } catch (SQLException | org.springframework.dao.DataAccessException e) {
      if (e instanceof SQLException sql && sql.getErrorCode() == DATABASE_ALREADY_OPEN) {
        throw new IOException("the service is running on " + dir.root() + " (its database "
            + dir.serviceDatabase() + ".mv.db is in use): activate the version through it "
            + "(POST /api/v1/models/" + version + "/activation), or stop it first; the version "
            + "in force is unchanged", e);
      }
      throw new IOException(dir.serviceDatabase() + ".mv.db: the activation could not be "
          + "recorded (" + e.getMessage() + "); the version in force is unchanged", e);
    }
    AtomicFiles.makePrivate(dir.serviceDatabase().getParent());
    return verdict;
  }
}
