package org.precedent.api.system;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.sql.Timestamp;
import java.time.Instant;
import java.util.List;
import java.util.concurrent.atomic.AtomicLong;
import org.precedent.engine.decide.Thresholds;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.context.SmartLifecycle;
import org.springframework.dao.DuplicateKeyException;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Component;

/**
 * Keeps replicas of the service on one database deciding with the same thresholds and the same
 * model version. A change through any replica writes the table {@code shared_in_force} (a row per
 * setting, with a revision counted up at each change) beside its audit record; every replica reads
 * the table every {@code precedent.shared.poll-ms} and puts a newer revision in force. So a change
 * is in force on every replica at most one interval (plus a model's opening, for a version) after
 * its request returns. The database is the truth: a replica starting adopts what the table holds,
 * and writes its own only where the table has none.
 */
@Component
public class ReplicaSync implements SmartLifecycle {
  static final String THRESHOLDS = "thresholds";
  static final String MODEL = "model";
  private static final Logger LOG = LoggerFactory.getLogger(ReplicaSync.class);
  private final JdbcTemplate db;
  private final InForceHolder holder;
  private final ObjectMapper json;
  private final long pollMs;
  // Revisions already in force here. No lock: a change's request thread holds the holder's swap
  // lock while it publishes, and the poll takes that lock to adopt, so a lock here could deadlock.
  private final AtomicLong seenThresholds = new AtomicLong(-1);
  private volatile boolean running;
  private volatile Thread thread;

  ReplicaSync(JdbcTemplate db, InForceHolder holder, ObjectMapper json,
      @Value("${precedent.shared.poll-ms:2000}") long pollMs) {
    if (pollMs < 1) {
      throw new IllegalArgumentException("precedent.shared.poll-ms must be positive, not "
          + pollMs);
    }
    this.db = db;
    this.holder = holder;
    this.json = json;
    this.pollMs = pollMs;
  }

  /**
   * Records the thresholds now in force for every replica; call in the audit's transaction, and
   * once it has committed, {@link #thresholdsCommitted} with the revision returned.
   */
  public long publishThresholds(Thresholds t) {
    return publish(THRESHOLDS, write(t));
  }

  /**
   * Notes a committed revision of this replica's own change, under the holder's swap lock (in
   * {@link InForceHolder#changeThresholds}'s callback), where the poll also looks: so a poll that
   * read an older revision before the change cannot put it in force after it.
   */
  public void thresholdsCommitted(long revision) {
    seenThresholds.accumulateAndGet(revision, Math::max);
  }

  /** Records the model version now in force for every replica; call in the audit's transaction. */
  public void publishVersion(String version) {
    publish(MODEL, version);
  }

  private long publish(String name, String content) {
    return publish(db, name, content);
  }

  /**
   * Records thresholds put in force outside the service (the command line's audited change) as
   * the shared ones, in the caller's transaction on {@code db}: otherwise the service's next start
   * would put the older shared row back in force over them.
   */
  public static void publishThresholds(JdbcTemplate db, Thresholds t) {
    publish(db, THRESHOLDS, write(new ObjectMapper(), t));
  }

  /**
   * Records a model version put in force outside the service (the command line's audited
   * activation) as the shared one, in the caller's transaction on {@code db}.
   */
  public static void publishVersion(JdbcTemplate db, String version) {
    publish(db, MODEL, version);
  }

  /** The thresholds the replicas share, as {@code db} holds them; empty before the first start. */
  public static java.util.Optional<Thresholds> sharedThresholds(JdbcTemplate db) {
    List<String> rows = db.queryForList("SELECT content FROM shared_in_force WHERE name = ?",
        String.class, THRESHOLDS);
    return rows.isEmpty() ? java.util.Optional.empty()
        : java.util.Optional.of(read(new ObjectMapper(), rows.get(0)));
  }

  private static long publish(JdbcTemplate db, String name, String content) {
    Timestamp now = Timestamp.from(Instant.now());
    String update = "UPDATE shared_in_force SET content = ?, revision = revision + 1, "
        + "changed_at = ? WHERE name = ?";
    if (db.update(update, content, now, name) == 0) {
      try {
        db.update("INSERT INTO shared_in_force (name, content, revision, changed_at) "
            + "VALUES (?, ?, 1, ?)", name, content, now);
      } catch (DuplicateKeyException raced) {
        db.update(update, content, now, name);
      }
    }
    Long revision = db.queryForObject("SELECT revision FROM shared_in_force WHERE name = ?",
        Long.class, name);
    return revision == null ? 0 : revision;
  }

  private record Row(String name, String content, long revision) {}

  /**
   * Puts in force whatever another replica changed since the last look. Runs on the sync thread
   * alone (and once at start, before that thread).
   */
  void poll() throws java.io.IOException {
    List<Row> rows = db.query("SELECT name, content, revision FROM shared_in_force",
        (rs, n) -> new Row(rs.getString(1), rs.getString(2), rs.getLong(3)));
    java.io.IOException first = null;
    for (Row r : rows) {
      try {
        adopt(r);
      } catch (java.io.IOException | RuntimeException e) {
        // One row's trouble does not keep the other from being put in force.
        first = first != null ? first : e instanceof java.io.IOException io ? io
            : new java.io.IOException(e.getMessage(), e);
      }
    }
    if (first != null) {
      throw first;
    }
  }

  private void adopt(Row r) throws java.io.IOException {
    if (r.name().equals(THRESHOLDS) && r.revision() > seenThresholds.get()) {
      Thresholds shared = read(r.content());
      if (holder.adoptThresholds(shared, () -> r.revision() > seenThresholds.get())) {
        LOG.info("thresholds changed by another replica put in force (revision {})",
            r.revision());
      }
      seenThresholds.accumulateAndGet(r.revision(), Math::max);
    } else if (r.name().equals(MODEL)) {
      // Compared by name, not revision: opening a version is checked against ACTIVE, which a
      // local activation writes first, so a poll that read an older row is refused there.
      if (holder.adoptVersion(r.content())) {
        LOG.info("model version {} activated by another replica put in force", r.content());
      }
    }
  }

  @Override
  public void start() {
    // Where the table has no row yet, this replica's own settings become the shared ones; a row
    // another replica made meanwhile wins.
    insertIfAbsent(THRESHOLDS, write(holder.thresholds()));
    insertIfAbsent(MODEL, holder.version());
    try {
      poll();
    } catch (java.io.IOException | RuntimeException e) {
      LOG.error("the settings shared by the replicas cannot be put in force: {}", e.getMessage());
    }
    running = true;
    Thread t = new Thread(this::run, "precedent-replica-sync");
    t.setDaemon(true);
    thread = t;
    t.start();
  }

  private void insertIfAbsent(String name, String content) {
    try {
      db.update("INSERT INTO shared_in_force (name, content, revision, changed_at) "
          + "SELECT ?, ?, 1, ? WHERE NOT EXISTS (SELECT 1 FROM shared_in_force WHERE name = ?)",
          name, content, Timestamp.from(Instant.now()), name);
    } catch (DuplicateKeyException raced) {
      // Another replica wrote it first: its row is the shared one.
    }
  }

  private void run() {
    boolean failing = false;
    while (running) {
      try {
        Thread.sleep(pollMs);
        poll();
        if (failing) {
          LOG.info("shared settings: read again");
          failing = false;
        }
      } catch (InterruptedException e) {
        return;
      } catch (Exception e) {
        // The database is away for a moment, or a version cannot be opened here: what is in
        // force stays, and the next interval tries again.
        if (!failing) {
          LOG.warn("shared settings could not be read or put in force ({}); trying every {} ms",
              e.getMessage(), pollMs);
          failing = true;
        }
      }
    }
  }

  private String write(Thresholds t) {
    return write(json, t);
  }

  private static String write(ObjectMapper json, Thresholds t) {
    try {
      return json.writeValueAsString(t);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("cannot write thresholds: " + e.getOriginalMessage(), e);
    }
  }

  private Thresholds read(String content) {
    return read(json, content);
  }

  private static Thresholds read(ObjectMapper json, String content) {
    try {
      return json.readValue(content, Thresholds.class);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("shared_in_force.content of 'thresholds' unreadable: "
          + e.getOriginalMessage(), e);
    }
  }

  @Override
  public void stop() {
    running = false;
    Thread t = thread;
    if (t != null) {
      t.interrupt();
    }
  }

  @Override
  public boolean isRunning() {
    return running;
  }
}
