package org.precedent.api.answers;

import java.io.IOException;
import java.nio.file.Path;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.precedent.api.answers.StoredAnswer.State;
import org.precedent.knowledge.group.AnswerGroup;
import org.precedent.knowledge.group.Grouping;
import org.precedent.knowledge.group.Slots;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * The answer library in the service's database: one stored answer per answer group, its state, its
 * versioned and audited changes. A new knowledge generation is synced in: new groups become
 * drafted answers; what people did to answers whose group remains (approval, edits, retirement) is
 * kept, and those whose group's replies changed are marked as changed underneath.
 */
public class AnswerLibrary {
  /** Who the audit names for changes made by grouping. */
  static final String GROUPING = "grouping";
  private final JdbcTemplate db;
  private final TransactionTemplate tx;
  private volatile String syncedGeneration;

  public AnswerLibrary(JdbcTemplate db, TransactionTemplate tx) {
    this.db = db;
    this.tx = tx;
  }

  /** What a sync did. */
  public record SyncReport(String generation, int created, List<String> changedUnderneath,
      List<String> refreshed, List<String> gone) {}

  /** Syncs the generation in force in {@code dir} unless it is the one synced last. */
  public synchronized Optional<SyncReport> syncIfNew(DataDir dir) throws IOException {
    Optional<Path> current = dir.currentGeneration();
    if (current.isEmpty() || current.get().getFileName().toString().equals(syncedGeneration)) {
      return Optional.empty();
    }
    Optional<Knowledge> k = Knowledge.open(dir);
    if (k.isEmpty()) {
      return Optional.empty();
    }
    String name = k.get().generation().getFileName().toString();
    SyncReport r = sync(name, k.get().grouping());
    syncedGeneration = name;
    return Optional.of(r);
  }

  /** Brings the library in line with {@code grouping}, in one transaction. */
  public synchronized SyncReport sync(String generation, Grouping grouping) {
    return tx.execute(status -> {
      Map<String, Row> rows = new HashMap<>();
      db.query("SELECT group_id, title, body, state, version, edited, sources, group_text, "
          + "present FROM library_answer", rs -> {
            Row r = new Row(rs.getString(1), rs.getString(2), rs.getString(3), rs.getString(4),
                rs.getInt(5), rs.getBoolean(6), rs.getString(7), rs.getString(8),
                rs.getBoolean(9));
            rows.put(r.id, r);
          });
      Titles titles = new Titles(grouping.groups().stream().map(AnswerGroup::answer).toList());
      Timestamp now = Timestamp.from(Instant.now());
      int created = 0;
      List<String> changed = new ArrayList<>();
      List<String> refreshed = new ArrayList<>();
      for (AnswerGroup g : grouping.groups()) {
        String sources = String.join("\n", g.ticketIds());
        String title = titles.title(g.category(), g.answer());
        Row r = rows.remove(g.id());
        if (r == null) {
          db.update("INSERT INTO library_answer (group_id, title, body, state, version, edited, "
              + "category, sources, source_count, group_text, changed_underneath, present, uses, "
              + "updated_at) VALUES (?, ?, ?, 'DRAFTED', 1, FALSE, ?, ?, ?, ?, FALSE, TRUE, 0, ?)",
              g.id(), title, g.answer(), g.category(), sources, g.size(), g.answer(), now);
          audit(g.id(), 1, "CREATED", GROUPING, now, null, title, null, g.answer(), null,
              State.DRAFTED.name(), "made by grouping (generation " + generation + ", "
                  + g.size() + " past replies)");
          created++;
          continue;
        }
        boolean differs = !r.sources.equals(sources) || !r.groupText.equals(g.answer());
        if (!differs && r.present) {
          continue;
        }
        // Untouched drafts follow their group; anything a person decided stays as decided.
        boolean untouched = r.state.equals(State.DRAFTED.name()) && !r.edited && r.version == 1;
        String body = untouched ? g.answer() : r.body;
        String newTitle = untouched ? title : r.title;
        db.update("UPDATE library_answer SET title = ?, body = ?, category = ?, sources = ?, "
            + "source_count = ?, group_text = ?, present = TRUE, changed_underneath = "
            + "(changed_underneath OR ?), updated_at = ? WHERE group_id = ?", newTitle, body,
            g.category(), sources, g.size(), g.answer(), differs && !untouched, now, g.id());
        if (differs) {
          (untouched ? refreshed : changed).add(g.id());
          audit(g.id(), r.version, "REGROUPED", GROUPING, now, r.title, newTitle, r.body, body,
              r.state, r.state, "the group's past replies changed (generation " + generation
                  + ", " + r.sources.lines().count() + " -> " + g.size() + " replies"
                  + (r.groupText.equals(g.answer()) ? "" : ", its text changed") + ")");
        }
      }
      List<String> gone = new ArrayList<>();
      for (Row r : rows.values()) {
        if (r.present) {
          db.update("UPDATE library_answer SET present = FALSE, updated_at = ? WHERE group_id = ?",
              now, r.id);
          gone.add(r.id);
        }
      }
      changed.sort(null);
      refreshed.sort(null);
      gone.sort(null);
      return new SyncReport(generation, created, changed, refreshed, gone);
    });
  }

  private record Row(String id, String title, String body, String state, int version,
      boolean edited, String sources, String groupText, boolean present) {}

  private static final String SELECT = "SELECT a.group_id, a.title, a.body, a.state, a.version, "
      + "a.edited, a.category, a.sources, a.group_text, a.changed_underneath, a.present, a.uses, "
      + "a.updated_at, "
      + "(SELECT COUNT(*) FROM suggestion_feedback f WHERE f.answer_group = a.group_id "
      + "AND f.verdict = 'ACCEPTED'), "
      + "(SELECT COUNT(*) FROM suggestion_feedback f WHERE f.answer_group = a.group_id "
      + "AND f.verdict = 'EDITED'), "
      + "(SELECT COUNT(*) FROM suggestion_feedback f WHERE f.answer_group = a.group_id "
      + "AND f.verdict = 'REJECTED') FROM library_answer a";

  private static StoredAnswer read(ResultSet rs, int n) throws SQLException {
    String sources = rs.getString(8);
    String text = rs.getString(3);
    return new StoredAnswer(rs.getString(1), rs.getString(2), text, rs.getString(4), rs.getInt(5),
        rs.getBoolean(6), rs.getString(7), sources.isEmpty() ? List.of() : sources.lines().toList(),
        rs.getString(9), Slots.names(text), rs.getBoolean(10), rs.getBoolean(11), rs.getLong(12),
        rs.getLong(14), rs.getLong(15), rs.getLong(16),
        rs.getTimestamp(13).toInstant().toString());
  }

  /**
   * The answers, most past replies first; {@code search} matches title, text, category or id
   * (without case), {@code state} narrows to one state; either may be null.
   */
  public List<StoredAnswer> list(String search, State state) {
    StringBuilder sql = new StringBuilder(SELECT).append(" WHERE 1 = 1");
    List<Object> args = new ArrayList<>();
    if (state != null) {
      sql.append(" AND a.state = ?");
      args.add(state.name());
    }
    if (search != null && !search.isBlank()) {
      // The pattern's own wild cards are escaped: a search is for the text typed.
      String like = "%" + search.strip().toLowerCase(Locale.ROOT).replace("\\", "\\\\")
          .replace("%", "\\%").replace("_", "\\_") + "%";
      sql.append(" AND (LOWER(a.title) LIKE ? ESCAPE '\\' OR LOWER(a.body) LIKE ? ESCAPE '\\'"
          + " OR LOWER(a.category) LIKE ? ESCAPE '\\' OR LOWER(a.group_id) LIKE ? ESCAPE '\\')");
      args.addAll(List.of(like, like, like, like));
    }
    sql.append(" ORDER BY a.source_count DESC, a.group_id");
    return db.query(sql.toString(), AnswerLibrary::read, args.toArray());
  }

  public Optional<StoredAnswer> find(String groupId) {
    return db.query(SELECT + " WHERE a.group_id = ?", AnswerLibrary::read, groupId).stream()
        .findFirst();
  }

  /** Changes the title and text; {@code version} must be the one the editor saw. */
  public StoredAnswer edit(String groupId, int version, String title, String text, String who,
      String reason) {
    return change(groupId, version, who, reason, "EDITED", old -> new Next(title, text,
        old.state(), true));
  }

  /** Puts the answer in force for automatic replies. */
  public StoredAnswer approve(String groupId, int version, String who, String reason) {
    return change(groupId, version, who, reason, "APPROVED", old -> {
      if (!old.present()) {
        throw new Conflict("answer " + groupId + " has no group in the knowledge in force; "
            + "an answer nobody can be given is not approved");
      }
      return new Next(old.title(), old.text(), State.APPROVED.name(), old.edited());
    });
  }

  /** Takes the answer out of automatic replies for good (until approved again). */
  public StoredAnswer retire(String groupId, int version, String who, String reason) {
    return change(groupId, version, who, reason, "RETIRED", old -> new Next(old.title(),
        old.text(), State.RETIRED.name(), old.edited()));
  }

  private record Next(String title, String text, String state, boolean edited) {}

  private StoredAnswer change(String groupId, int version, String who, String reason,
      String action, java.util.function.Function<StoredAnswer, Next> next) {
    return tx.execute(status -> {
      StoredAnswer old = find(groupId).orElseThrow(() -> new UnknownAnswer(groupId));
      if (old.version() != version) {
        throw new Conflict(staleMessage(old, version));
      }
      Next n = next.apply(old);
      Timestamp now = Timestamp.from(Instant.now());
      // The version in the condition makes two changes made on one version exclusive: the second
      // updates nothing, and is refused, whichever transaction it runs in.
      int updated = db.update("UPDATE library_answer SET title = ?, body = ?, state = ?, "
          + "edited = ?, version = version + 1, changed_underneath = FALSE, updated_at = ? "
          + "WHERE group_id = ? AND version = ?", n.title(), n.text(), n.state(), n.edited(), now,
          groupId, version);
      if (updated != 1) {
        throw new Conflict(staleMessage(old, version));
      }
      audit(groupId, version + 1, action, who, now, old.title(), n.title(), old.text(), n.text(),
          old.state(), n.state(), reason);
      return find(groupId).orElseThrow();
    });
  }

  private static String staleMessage(StoredAnswer now, int version) {
    return "answer " + now.groupId() + " is at version " + now.version() + ", not " + version
        + ": someone changed it meanwhile; read it again and redo the change";
  }

  private void audit(String groupId, int version, String action, String who, Timestamp at,
      String oldTitle, String newTitle, String oldBody, String newBody, String oldState,
      String newState, String reason) {
    db.update("INSERT INTO library_answer_change (group_id, version, action, changed_by, "
        + "changed_at, old_title, new_title, old_body, new_body, old_state, new_state, reason) "
        + "VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)", groupId, version, action, who, at,
        oldTitle, newTitle, oldBody, newBody, oldState, newState, reason);
  }

  /** The audit of one answer (or of all, when {@code groupId} is null), latest first. */
  public List<AnswerChange> changes(String groupId, int limit) {
    String sql = "SELECT id, group_id, version, action, changed_by, changed_at, old_title, "
        + "new_title, old_body, new_body, old_state, new_state, reason FROM library_answer_change"
        + (groupId == null ? "" : " WHERE group_id = ?") + " ORDER BY id DESC";
    Object[] args = groupId == null ? new Object[0] : new Object[] {groupId};
    return db.query(sql, (rs, n) -> new AnswerChange(rs.getLong(1), rs.getString(2),
        rs.getInt(3), rs.getString(4), rs.getString(5),
        rs.getTimestamp(6).toInstant().toString(), rs.getString(7), rs.getString(8),
        rs.getString(9), rs.getString(10), rs.getString(11), rs.getString(12),
        rs.getString(13)), args).stream().limit(limit).toList();
  }

  /** The texts agents last sent after editing this answer's suggestion, latest first. */
  public List<Map<String, Object>> recentEdits(String groupId, int limit) {
    return db.query("SELECT agent, recorded_at, final_text, proposed FROM suggestion_feedback "
        + "WHERE answer_group = ? AND verdict = 'EDITED' ORDER BY id DESC", (rs, n) -> {
          Map<String, Object> m = new java.util.LinkedHashMap<>();
          m.put("agent", rs.getString(1));
          m.put("recordedAt", rs.getTimestamp(2).toInstant().toString());
          m.put("text", rs.getString(3));
          // The agent offered it as the answer's next version (a manager adopts it by editing).
          m.put("proposed", rs.getBoolean(4));
          return m;
        }, groupId).stream().limit(limit).toList();
  }

  /** Counts an automatic reply sent with the answer. */
  public void recordUse(String groupId) {
    db.update("UPDATE library_answer SET uses = uses + 1 WHERE group_id = ?", groupId);
  }

  /** No answer has this id. */
  public static final class UnknownAnswer extends RuntimeException {
    UnknownAnswer(String id) {
      super("no answer '" + id + "' in the library", null, false, false);
    }
  }

  /** The change was made on a version that is no longer current, or cannot be made now. */
  public static final class Conflict extends RuntimeException {
    Conflict(String message) {
      super(message, null, false, false);
    }
  }
}
