package org.precedent.api.queue;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.sql.Timestamp;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.precedent.api.suggest.DecisionView;
import org.precedent.knowledge.clean.TextCleaner;
import org.springframework.dao.DuplicateKeyException;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Component;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * The durable queue: a ticket is committed to the database before its submission is acknowledged,
 * is claimed by flipping its status in a conditional update, and gets its decision in the same
 * transaction that marks it decided. The decision table is keyed by ticket id, so a ticket can
 * never be decided twice; a claim left by a crash is released at the next start and the ticket
 * decided then.
 */
@Component
class TicketQueue {
  static final int MAX_ATTEMPTS = 3;
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
    String category = r.category() == null || r.category().isBlank() ? null : r.category().strip();
    try {
      db.update("INSERT INTO queue_ticket (ticket_id, question, category, status, submitted_by, "
          + "submitted_at) VALUES (?, ?, ?, 'PENDING', ?, ?)", r.ticketId(), question, category,
          submitter, Timestamp.from(Instant.now()));
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
    List<TicketView> rows = db.query("SELECT t.ticket_id, t.status, t.question, t.category, "
        + "t.submitted_at, d.decided_at, d.body FROM queue_ticket t "
        + "LEFT JOIN ticket_decision d ON d.ticket_id = t.ticket_id WHERE t.ticket_id = ?",
        (rs, n) -> new TicketView(rs.getString(1), rs.getString(2), rs.getString(3),
            rs.getString(4), rs.getTimestamp(5).toInstant().toString(),
            rs.getTimestamp(6) == null ? null : rs.getTimestamp(6).toInstant().toString(),
            rs.getString(7) == null ? null : read(rs.getString(7))), id);
    return rows.stream().findFirst();
  }

  /** Releases claims a previous run left behind (it stopped mid-decision); returns how many. */
  int releaseClaims() {
    return db.update("UPDATE queue_ticket SET status = 'PENDING', claimed_at = NULL "
        + "WHERE status = 'CLAIMED'");
  }

  /** Claims up to {@code max} pending tickets, oldest first. */
  List<Claimed> claim(int max) {
    List<Claimed> out = new ArrayList<>();
    List<Claimed> pending = db.query("SELECT ticket_id, question, category, attempts "
        + "FROM queue_ticket WHERE status = 'PENDING' ORDER BY seq FETCH FIRST " + max
        + " ROWS ONLY", (rs, n) -> new Claimed(rs.getString(1), rs.getString(2),
        rs.getString(3), rs.getInt(4) + 1));
    for (Claimed c : pending) {
      // The status condition makes the claim exclusive even with several workers.
      int won = db.update("UPDATE queue_ticket SET status = 'CLAIMED', claimed_at = ?, "
          + "attempts = attempts + 1 WHERE ticket_id = ? AND status = 'PENDING'",
          Timestamp.from(Instant.now()), c.ticketId());
      if (won == 1) {
        out.add(c);
      }
    }
    return out;
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
      int marked = db.update("UPDATE queue_ticket SET status = 'DECIDED' WHERE ticket_id = ? "
          + "AND status = 'CLAIMED'", c.ticketId());
      if (marked != 1) {
        throw new IllegalStateException("ticket " + c.ticketId() + " is no longer claimed");
      }
    });
  }

  /** Puts a ticket whose decision failed back in the queue, or gives up after a few tries. */
  void failed(Claimed c) {
    db.update("UPDATE queue_ticket SET status = ?, claimed_at = NULL WHERE ticket_id = ? "
        + "AND status = 'CLAIMED'", c.attempt() >= MAX_ATTEMPTS ? "FAILED" : "PENDING",
        c.ticketId());
  }

  long count(String status) {
    Long n = db.queryForObject("SELECT COUNT(*) FROM queue_ticket WHERE status = ?", Long.class,
        status);
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
