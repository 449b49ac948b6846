package org.precedent.api.queue;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.sql.Timestamp;
import java.time.Duration;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import org.precedent.api.decision.DecisionView;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.ticket.Category;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.dao.DuplicateKeyException;
import org.springframework.jdbc.core.ConnectionCallback;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Component;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * The durable queue: a ticket is committed to the database before its submission is acknowledged,
 * is claimed in batches by one replica ({@code FOR UPDATE SKIP LOCKED}, the replica's id and a
 * lease stamped on it), and gets its decision in the same transaction that marks it decided, by a
 * conditional update that only the claim's owner on the claim's attempt passes. The decision table
 * is keyed by ticket id, so a ticket can never be decided twice; a claim whose replica stopped is
 * taken by another replica once its lease ends, or released when the same replica starts again. Every claim counts an attempt in the database, so a ticket that cannot be decided
 * (whether its decision fails or takes the service down with it) is tried a bounded number of
 * times, across restarts too, and then marked failed with the reason.
 */
@Component
class TicketQueue {
  static final int MAX_ATTEMPTS = 3;
  static final int FAILURE_CHARS = 2000;
  private final JdbcTemplate db;
  private final TransactionTemplate tx;
  private final ObjectMapper json;
  private final TextCleaner cleaner = TextCleaner.standard();
  private final String owner;
  private final Duration lease;
  private volatile Boolean sole;

  @Autowired
  TicketQueue(JdbcTemplate db, TransactionTemplate tx, ObjectMapper json,
      @Value("${precedent.replica.id:}") String replicaId,
      @Value("${precedent.queue.lease-seconds:30}") long leaseSeconds) {
    this(db, tx, json, ReplicaId.orGenerated(replicaId), Duration.ofSeconds(leaseSeconds));
  }

  TicketQueue(JdbcTemplate db, TransactionTemplate tx, ObjectMapper json, String owner,
      Duration lease) {
    if (lease.isNegative() || lease.isZero()) {
      throw new IllegalArgumentException("precedent.queue.lease-seconds must be positive, not "
          + lease.toSeconds());
    }
    this.db = db;
    this.tx = tx;
    this.json = json;
    this.owner = owner;
    this.lease = lease;
  }

  /** What a submission did. */
  record Submitted(TicketView ticket, boolean created) {}

  /** Thrown when an id comes back with a different question. */
  static final class Conflict extends RuntimeException {
    Conflict(String id) {
      super("ticket " + id + " was already submitted with a different question");
    }
  }

  Submitted submit(SubmitRequest r, String submitter) {
    // Only the redacted text is ever stored or logged, the fields' values as the question.
    String question = cleaner.cleanQuestion(r.question());
    String category = Category.normalise(r.category());
    Map<String, String> fields = new TreeMap<>();
    if (r.fields() != null) {
      r.fields().forEach((k, v) -> fields.put(k, cleaner.redact(v)));
    }
    try {
      db.update("INSERT INTO queue_ticket (ticket_id, question, category, status, submitted_by, "
          + "submitted_at, fields) VALUES (?, ?, ?, ?, ?, ?, ?)", r.ticketId(), question,
          category, TicketState.QUEUED.name(), submitter, Timestamp.from(Instant.now()),
          fields.isEmpty() ? null : writeFields(fields));
      return new Submitted(find(r.ticketId()).orElseThrow(), true);
    } catch (DuplicateKeyException again) {
      TicketView first = find(r.ticketId()).orElseThrow();
      if (!first.question().equals(question)) {
        throw new Conflict(r.ticketId());
      }
      return new Submitted(first, false);
    }
  }

  Optional<TicketView> find(String id) {
    List<TicketView> rows = db.query("SELECT t.ticket_id, t.status, t.attempts, t.failure, "
        + "t.question, t.category, t.submitted_at, d.decided_at, d.body FROM queue_ticket t "
        + "LEFT JOIN ticket_decision d ON d.ticket_id = t.ticket_id WHERE t.ticket_id = ?",
        (rs, n) -> new TicketView(rs.getString(1), rs.getString(2), rs.getInt(3),
            rs.getString(4), rs.getString(5), rs.getString(6),
            rs.getTimestamp(7).toInstant().toString(),
            rs.getTimestamp(8) == null ? null : rs.getTimestamp(8).toInstant().toString(),
            rs.getString(9) == null ? null : read(rs.getString(9))), id);
    return rows.stream().findFirst();
  }

  /** What {@link #releaseClaims} did. */
  record Released(int queued, int failed) {}

  /**
   * Releases claims a previous run of this replica left behind (it stopped mid-decision): back in
   * the queue, or failed when that was the last attempt. The service may have stopped because of
   * the ticket itself, so a restart must not give it more tries. On H2 the database file admits
   * one process, so every claim in it is a dead one; on a shared database only this replica's own
   * claims, and those made before claims had owners, are known dead: another replica's wait for
   * their lease to end ({@link #claimBatch}).
   */
  Released releaseClaims() {
    String whose = soleService() ? "" : " AND (claim_owner = ? OR claim_owner IS NULL)";
    Object[] mine = soleService() ? new Object[0] : new Object[] {owner};
    int failed = db.update("UPDATE queue_ticket SET status = ?, claimed_at = NULL, "
        + "lease_until = NULL, failure = ? WHERE (status = ? OR status = ?) AND attempts >= ?"
        + whose, concat(new Object[] {TicketState.FAILED.name(), "the service stopped while "
        + "deciding it, " + MAX_ATTEMPTS + " times", TicketState.DECIDING.name(),
        TicketState.QUEUED.name(), MAX_ATTEMPTS}, mine));
    int queued = db.update("UPDATE queue_ticket SET status = ?, claimed_at = NULL, "
        + "lease_until = NULL, claim_owner = NULL, "
        + "failure = COALESCE(failure, 'the service stopped while deciding it') WHERE status = ?"
        + whose, concat(new Object[] {TicketState.QUEUED.name(), TicketState.DECIDING.name()},
        mine));
    return new Released(queued, failed);
  }

  /**
   * Claims up to {@code n} of the oldest tickets that are queued, or whose claim's lease has
   * ended (its replica stopped or stalled), and that have tries left. {@code FOR UPDATE SKIP
   * LOCKED} lets replicas claim at once without waiting on each other's rows; the claim stamps
   * this replica as owner, a lease until the database's now plus the lease, and counts the
   * attempt, all in one transaction, so no crash leaves a try uncounted. An ended claim on its
   * last try is marked failed rather than tried again.
   */
  List<Claimed> claimBatch(int n) {
    return tx.execute(status -> {
      Instant now = databaseNow();
      failEndedLastTries(now);
      long deadline = System.nanoTime() + lease.toNanos();
      List<Claimed> rows = db.query("SELECT seq, ticket_id, question, category, attempts, "
          + "fields FROM queue_ticket WHERE (status = ? OR (status = ? AND lease_until < ?)) "
          + "AND attempts < ? ORDER BY seq LIMIT ? FOR UPDATE SKIP LOCKED",
          (rs, i) -> new Claimed(rs.getLong(1), rs.getString(2), rs.getString(3),
              rs.getString(4), rs.getInt(5) + 1, deadline, fields(rs.getString(6))),
          TicketState.QUEUED.name(),
          TicketState.DECIDING.name(), Timestamp.from(now), MAX_ATTEMPTS, n);
      Timestamp until = Timestamp.from(now.plus(lease));
      for (Claimed c : rows) {
        db.update("UPDATE queue_ticket SET status = ?, claim_owner = ?, claimed_at = ?, "
            + "lease_until = ?, attempts = attempts + 1 WHERE seq = ?",
            TicketState.DECIDING.name(), owner, Timestamp.from(now), until, c.seq());
      }
      return rows;
    });
  }

  /**
   * Marks failed the claims whose lease ended before {@code now} on their last try (the replica
   * deciding them stopped, {@link #MAX_ATTEMPTS} times), in the caller's transaction; returns how
   * many. The rows are locked with {@code FOR UPDATE SKIP LOCKED} before they are written: a plain
   * {@code UPDATE} over them would wait on any row another replica holds, and two replicas each
   * holding a row the other's update wants would deadlock (PostgreSQL then aborts one). A row held
   * elsewhere is passed over; the next claim, here or on another replica, fails it.
   */
  int failEndedLastTries(Instant now) {
    List<Long> ended = db.queryForList("SELECT seq FROM queue_ticket WHERE status = ? "
        + "AND lease_until < ? AND attempts >= ? ORDER BY seq FOR UPDATE SKIP LOCKED",
        Long.class, TicketState.DECIDING.name(), Timestamp.from(now), MAX_ATTEMPTS);
    if (ended.isEmpty()) {
      return 0;
    }
    db.batchUpdate("UPDATE queue_ticket SET status = ?, lease_until = NULL, failure = ? "
        + "WHERE seq = ? AND status = ?", ended.stream().map(seq -> new Object[] {
            TicketState.FAILED.name(), "the replica deciding it stopped before its lease ended, "
            + MAX_ATTEMPTS + " times", seq, TicketState.DECIDING.name()}).toList());
    return ended.size();
  }

  /** Claims the oldest queued ticket that has tries left, if there is one. */
  Optional<Claimed> claimNext() {
    return claimBatch(1).stream().findFirst();
  }

  /**
   * A claimed ticket; {@code attempt} counts this try, and with the owner it is the claim's token:
   * a later claim of the same ticket counts another attempt. {@code deadlineNanos} is when the
   * lease ends by this process's {@link System#nanoTime} clock, measured from before the claim.
   */
  record Claimed(long seq, String ticketId, String question, String category, int attempt,
      long deadlineNanos, Map<String, String> fields) {

    Claimed {
      fields = Map.copyOf(fields);
    }

    /** Whether the lease still has {@code margin} to run. */
    boolean leaseLeft(Duration margin) {
      return deadlineNanos - System.nanoTime() > margin.toNanos();
    }
  }

  /** This replica's id, the owner of its claims. */
  String owner() {
    return owner;
  }

  /**
   * Stores the decision and marks the ticket decided, both or neither, if the claim is still
   * this replica's: still deciding, with this owner and this attempt. A lease that ended is no
   * bar while nobody claimed the ticket since (the work is good and nobody else does it); once
   * another replica has claimed it, this write is refused and {@code false} returned, so the
   * ticket is decided once, by the replica that holds it.
   */
  boolean decided(Claimed c, DecisionView d) {
    String body = write(d);
    Boolean stored = tx.execute(status -> {
      Instant now = databaseNow();
      int marked = db.update("UPDATE queue_ticket SET status = ?, failure = NULL, "
          + "lease_until = NULL WHERE ticket_id = ? AND status = ? AND claim_owner = ? "
          + "AND attempts = ?", TicketState.DECIDED.name(), c.ticketId(),
          TicketState.DECIDING.name(), owner, c.attempt());
      if (marked != 1) {
        return false;
      }
      db.update("INSERT INTO ticket_decision (ticket_id, outcome, reason, confidence, threshold, "
          + "model_version, decided_at, body) VALUES (?, ?, ?, ?, ?, ?, ?, ?)", c.ticketId(),
          d.outcome(), d.reason(), d.confidence(), d.threshold(), d.modelVersion(),
          Timestamp.from(now), body);
      return true;
    });
    return Boolean.TRUE.equals(stored);
  }

  /**
   * Puts a ticket whose decision failed back in the queue, or marks it failed after its last try;
   * {@code reason} is kept either way and shown with the ticket. Refused ({@code false}) when the
   * claim is no longer this replica's, as {@link #decided} is.
   */
  boolean failed(Claimed c, String reason) {
    String kept = reason.length() <= FAILURE_CHARS ? reason
        : reason.substring(0, FAILURE_CHARS - 1) + "\u2026";
    return db.update("UPDATE queue_ticket SET status = ?, claimed_at = NULL, lease_until = NULL, "
        + "failure = ? WHERE ticket_id = ? AND status = ? AND claim_owner = ? AND attempts = ?",
        (c.attempt() >= MAX_ATTEMPTS ? TicketState.FAILED : TicketState.QUEUED).name(), kept,
        c.ticketId(), TicketState.DECIDING.name(), owner, c.attempt()) == 1;
  }

  /**
   * Gives back a claim this replica will not decide (it is stopping, or the claim's lease ran
   * short): queued again at once, its attempt uncounted, since nothing was tried.
   */
  void giveBack(Claimed c) {
    db.update("UPDATE queue_ticket SET status = ?, claim_owner = NULL, claimed_at = NULL, "
        + "lease_until = NULL, attempts = attempts - 1 WHERE ticket_id = ? AND status = ? "
        + "AND claim_owner = ? AND attempts = ?", TicketState.QUEUED.name(), c.ticketId(),
        TicketState.DECIDING.name(), owner, c.attempt());
  }

  /** The database's clock: every replica's leases are measured by the one clock. */
  Instant databaseNow() {
    OffsetDateTime now = db.queryForObject("SELECT CURRENT_TIMESTAMP",
        (rs, i) -> rs.getObject(1, OffsetDateTime.class));
    return now == null ? Instant.now() : now.toInstant();
  }

  private boolean soleService() {
    Boolean h2 = sole;
    if (h2 == null) {
      h2 = db.execute((ConnectionCallback<Boolean>) c ->
          c.getMetaData().getDatabaseProductName().equals("H2"));
      sole = h2;
    }
    return Boolean.TRUE.equals(h2);
  }

  private static Object[] concat(Object[] a, Object[] b) {
    Object[] all = java.util.Arrays.copyOf(a, a.length + b.length);
    System.arraycopy(b, 0, all, a.length, b.length);
    return all;
  }

  long count(TicketState state) {
    Long n = db.queryForObject("SELECT COUNT(*) FROM queue_ticket WHERE status = ?", Long.class,
        state.name());
    return n == null ? 0 : n;
  }

  private String writeFields(Map<String, String> fields) {
    try {
      return json.writeValueAsString(fields);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("cannot write a ticket's fields: " + e.getMessage(), e);
    }
  }

  private Map<String, String> fields(String stored) {
    if (stored == null) {
      return Map.of();
    }
    try {
      return json.readValue(stored, new com.fasterxml.jackson.core.type.TypeReference<
          Map<String, String>>() { });
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("stored fields unreadable: " + e.getOriginalMessage(), e);
    }
  }

  private String write(DecisionView d) {
    try {
      return json.writeValueAsString(d);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("cannot write decision of " + e.getMessage(), e);
    }
  }

  private DecisionView read(String body) {
    try {
      return json.readValue(body, DecisionView.class);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("stored decision unreadable: " + e.getOriginalMessage(), e);
    }
  }
}
