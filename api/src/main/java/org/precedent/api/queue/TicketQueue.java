package org.precedent.api.queue;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.sql.Timestamp;
import java.time.Instant;
import java.util.List;
import java.util.Optional;
import org.precedent.api.decision.DecisionView;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.ticket.Category;
import org.springframework.dao.DuplicateKeyException;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Component;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * The durable queue: a ticket is committed to the database before its submission is acknowledged,
 * is claimed by flipping its status in a conditional update, and gets its decision in the same
 * transaction that marks it decided. The decision table is keyed by ticket id, so a ticket can
 * never be decided twice; a claim left by a crash is released at the next start and the ticket
 * decided then. Every claim counts an attempt in the database, so a ticket that cannot be decided
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

  TicketQueue(JdbcTemplate db, TransactionTemplate tx, ObjectMapper json) {
    this.db = db;
    this.tx = tx;
    this.json = json;
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
    // Only the redacted text is ever stored or logged.
    String question = cleaner.cleanQuestion(r.question());
    String category = Category.normalise(r.category());
    try {
      db.update("INSERT INTO queue_ticket (ticket_id, question, category, status, submitted_by, "
          + "submitted_at) VALUES (?, ?, ?, ?, ?, ?)", r.ticketId(), question, category,
          TicketState.QUEUED.name(), submitter, Timestamp.from(Instant.now()));
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
   * Releases claims a previous run left behind (it stopped mid-decision): back in the queue, or
   * failed when that was the last attempt. The service may have stopped because of the ticket
   * itself, so a restart must not give it more tries.
   */
  Released releaseClaims() {
    int failed = db.update("UPDATE queue_ticket SET status = ?, claimed_at = NULL, failure = ? "
        + "WHERE (status = ? OR status = ?) AND attempts >= ?", TicketState.FAILED.name(),
        "the service stopped while deciding it, " + MAX_ATTEMPTS + " times",
        TicketState.DECIDING.name(), TicketState.QUEUED.name(), MAX_ATTEMPTS);
    int queued = db.update("UPDATE queue_ticket SET status = ?, claimed_at = NULL, "
        + "failure = COALESCE(failure, 'the service stopped while deciding it') WHERE status = ?",
        TicketState.QUEUED.name(), TicketState.DECIDING.name());
    return new Released(queued, failed);
  }

  /** Claims the oldest queued ticket that has tries left, if there is one. */
  Optional<Claimed> claimNext() {
    while (true) {
      List<Claimed> next = db.query("SELECT ticket_id, question, category, attempts "
          + "FROM queue_ticket WHERE status = ? AND attempts < ? ORDER BY seq FETCH FIRST 1 ROWS "
          + "ONLY", (rs, n) -> new Claimed(rs.getString(1), rs.getString(2), rs.getString(3),
          rs.getInt(4) + 1), TicketState.QUEUED.name(), MAX_ATTEMPTS);
      if (next.isEmpty()) {
        return Optional.empty();
      }
      Claimed c = next.get(0);
      // The conditions make the claim exclusive even with several workers, and the attempt is
      // counted in the same update, so no crash can leave a try uncounted.
      int won = db.update("UPDATE queue_ticket SET status = ?, claimed_at = ?, "
          + "attempts = attempts + 1 WHERE ticket_id = ? AND status = ? AND attempts = ?",
          TicketState.DECIDING.name(), Timestamp.from(Instant.now()), c.ticketId(),
          TicketState.QUEUED.name(), c.attempt() - 1);
      if (won == 1) {
        return Optional.of(c);
      }
    }
  }

  /** A claimed ticket; {@code attempt} counts this try. */
  record Claimed(String ticketId, String question, String category, int attempt) {}

  /** Stores the decision and marks the ticket decided, both or neither. */
  void decided(Claimed c, DecisionView d) {
    String body = write(d);
    tx.executeWithoutResult(status -> {
      db.update("INSERT INTO ticket_decision (ticket_id, outcome, reason, confidence, threshold, "
          + "model_version, decided_at, body) VALUES (?, ?, ?, ?, ?, ?, ?, ?)", c.ticketId(),
          d.outcome(), d.reason(), d.confidence(), d.threshold(), d.modelVersion(),
          Timestamp.from(Instant.now()), body);
      int marked = db.update("UPDATE queue_ticket SET status = ?, failure = NULL "
          + "WHERE ticket_id = ? AND status = ?", TicketState.DECIDED.name(), c.ticketId(),
          TicketState.DECIDING.name());
      if (marked != 1) {
        throw new IllegalStateException("ticket " + c.ticketId() + " is no longer claimed");
      }
    });
  }

  /**
   * Puts a ticket whose decision failed back in the queue, or marks it failed after its last try;
   * {@code reason} is kept either way and shown with the ticket.
   */
  void failed(Claimed c, String reason) {
    String kept = reason.length() <= FAILURE_CHARS ? reason
        : reason.substring(0, FAILURE_CHARS - 1) + "\u2026";
    db.update("UPDATE queue_ticket SET status = ?, claimed_at = NULL, failure = ? "
        + "WHERE ticket_id = ? AND status = ?",
        (c.attempt() >= MAX_ATTEMPTS ? TicketState.FAILED : TicketState.QUEUED).name(), kept,
        c.ticketId(), TicketState.DECIDING.name());
  }

  long count(TicketState state) {
    Long n = db.queryForObject("SELECT COUNT(*) FROM queue_ticket WHERE status = ?", Long.class,
        state.name());
    return n == null ? 0 : n;
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
