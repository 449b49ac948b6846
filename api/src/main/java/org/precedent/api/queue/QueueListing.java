package org.precedent.api.queue;

import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;
import org.precedent.engine.decide.HandOffReason;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Component;

/**
 * The queue as agents read it: every ticket, newest first, filtered by where it is, by hand-off
 * reason and by text, a page at a time. Plain SQL that H2 and PostgreSQL both run.
 */
@Component
class QueueListing {
  static final int QUESTION_CHARS = 300;
  static final int SEARCH_CHARS = 200;
  static final int MAX_PAGE_SIZE = 100;

  /** Where a ticket is, as the list names it. */
  enum State {
    /** Stored and not decided yet (waiting, or being decided now). */
    RECEIVED,
    /** Decided: the reply went out on its own. */
    REPLIED,
    /** Decided: a person answers it, for the reason given. */
    HANDED_OFF,
    /** No decision could be made: a person must take it. */
    FAILED
  }

  /** What to list; null fields do not filter. */
  record Filter(State state, HandOffReason reason, String search) {}

  /** One page of the list, and how many tickets the filter matches in all. */
  record Page(int page, int size, long total, List<TicketSummary> tickets) {}

  private final JdbcTemplate db;

  QueueListing(JdbcTemplate db) {
    this.db = db;
  }

  static State state(String given) {
    return named(State.class, given);
  }

  static HandOffReason reason(String given) {
    return named(HandOffReason.class, given);
  }

  /** The constant named, in any case, with - for _; else says which names there are. */
  private static <E extends Enum<E>> E named(Class<E> type, String given) {
    try {
      return Enum.valueOf(type, given.strip().toUpperCase(Locale.ROOT).replace('-', '_'));
    } catch (IllegalArgumentException e) {
      throw new IllegalArgumentException("must be one of " + Arrays.stream(type.getEnumConstants())
          .map(s -> s.name().toLowerCase(Locale.ROOT)).collect(Collectors.joining(", ")));
    }
  }

  /** Page {@code page} (from 1) of {@code size} tickets, newest first. */
  Page list(Filter f, int page, int size) {
    StringBuilder where = new StringBuilder(" WHERE 1 = 1");
    List<Object> args = new ArrayList<>();
    if (f.state() != null) {
      switch (f.state()) {
        case RECEIVED -> {
          where.append(" AND t.status IN (?, ?)");
          args.add(TicketState.QUEUED.name());
          args.add(TicketState.DECIDING.name());
        }
        case REPLIED, HANDED_OFF -> {
          where.append(" AND t.status = ? AND d.outcome = ?");
          args.add(TicketState.DECIDED.name());
          args.add(f.state() == State.REPLIED ? "REPLY" : "HAND_OFF");
        }
        case FAILED -> {
          where.append(" AND t.status = ?");
          args.add(TicketState.FAILED.name());
        }
      }
    }
    if (f.reason() != null) {
      // Stored as the decision view writes it: the name in lower case.
      where.append(" AND t.status = ? AND d.outcome = ? AND d.reason = ?");
      args.add(TicketState.DECIDED.name());
      args.add("HAND_OFF");
      args.add(f.reason().name().toLowerCase(Locale.ROOT));
    }
    if (f.search() != null && !f.search().isBlank()) {
      // The pattern's own wild cards are escaped: a search is for the text typed.
      String like = "%" + f.search().strip().toLowerCase(Locale.ROOT).replace("\\", "\\\\")
          .replace("%", "\\%").replace("_", "\\_") + "%";
      where.append(" AND (LOWER(t.ticket_id) LIKE ? ESCAPE '\\' OR LOWER(t.question) LIKE ? "
          + "ESCAPE '\\' OR LOWER(t.category) LIKE ? ESCAPE '\\')");
      args.add(like);
      args.add(like);
      args.add(like);
    }
    String from = " FROM queue_ticket t LEFT JOIN ticket_decision d ON d.ticket_id = t.ticket_id";
    Long total = db.queryForObject("SELECT COUNT(*)" + from + where, Long.class, args.toArray());
    List<Object> paged = new ArrayList<>(args);
    paged.add(size);
    paged.add((long) (page - 1) * size);
    List<TicketSummary> rows = db.query("SELECT t.ticket_id, t.status, t.attempts, t.failure, "
        + "SUBSTRING(t.question, 1, " + QUESTION_CHARS + "), t.category, t.submitted_at, "
        + "d.outcome, d.reason, d.confidence, d.threshold, d.decided_at" + from + where
        + " ORDER BY t.seq DESC LIMIT ? OFFSET ?", QueueListing::summary, paged.toArray());
    return new Page(page, size, total == null ? 0 : total, rows);
  }

  private static TicketSummary summary(ResultSet rs, int n) throws SQLException {
    String status = rs.getString(2);
    String outcome = rs.getString(8);
    State state;
    if (TicketState.FAILED.name().equals(status)) {
      state = State.FAILED;
    } else if (TicketState.DECIDED.name().equals(status) && outcome != null) {
      state = outcome.equals("REPLY") ? State.REPLIED : State.HANDED_OFF;
    } else {
      state = State.RECEIVED;
    }
    double confidence = rs.getDouble(10);
    Double c = rs.wasNull() ? null : confidence;
    double threshold = rs.getDouble(11);
    Double t = rs.wasNull() ? null : threshold;
    return new TicketSummary(rs.getString(1), state.name(), status, rs.getInt(3), rs.getString(4),
        rs.getString(5), rs.getString(6), state == State.HANDED_OFF ? rs.getString(9) : null, c,
        t, instant(rs.getTimestamp(7)), instant(rs.getTimestamp(12)));
  }

  private static String instant(Timestamp t) {
    return t == null ? null : t.toInstant().toString();
  }
}
