package org.precedent.api.suggest;

import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.precedent.api.system.CommandLineDatabase;
import org.precedent.engine.rerank.TrainingPair;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.group.AnswerGroup;
import org.precedent.knowledge.group.Slots;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;

/**
 * Agents' feedback as training pairs: each suggestion an agent accepted or edited and sent becomes
 * a (question, text sent) pair for the reranker, read from the service's database by the command
 * line ({@link CommandLineDatabase}). Only the reranker learns from them: fusion and calibration
 * stay fitted on stored tickets alone, whose answer groups are known, so that the confidence is
 * measured on the questions customers ask rather than on those agents chose to answer.
 */
public final class FeedbackTraining {
  /** Why a row of feedback was not added. */
  public static final String REJECTED = "rejected (nothing was sent)";
  public static final String STORED = "its ticket is among the stored tickets already";
  public static final String NO_TEXT = "accepted before its text was kept, and its answer group "
      + "is gone";
  public static final String EMPTY = "empty question or text";
  public static final String SLOTS = "accepted with slots a person filled in (the text sent is not "
      + "known)";
  public static final String DUPLICATE = "the same question and text as earlier feedback";

  /**
   * What was read.
   *
   * @param pairs       the pairs to add, oldest feedback first
   * @param skipped     how many rows were left out, by why
   * @param unavailable why the feedback could not be read at all (the service holds its
   *                    database), else null
   */
  public record Read(List<TrainingPair> pairs, Map<String, Integer> skipped, String unavailable) {
    public int skippedCount() {
      return skipped.values().stream().mapToInt(Integer::intValue).sum();
    }

    /** One line for the command's output. */
    public String summary() {
      if (unavailable != null) {
        return "agents' feedback: not read: " + unavailable;
      }
      StringBuilder s = new StringBuilder("agents' feedback: " + pairs.size() + " added, "
          + skippedCount() + " skipped");
      if (!skipped.isEmpty()) {
        s.append(" (");
        String sep = "";
        for (Map.Entry<String, Integer> e : skipped.entrySet()) {
          s.append(sep).append(e.getValue()).append(' ').append(e.getKey());
          sep = "; ";
        }
        s.append(')');
      }
      return s.toString();
    }
  }

  private FeedbackTraining() {}

  /**
   * Reads every accepted or edited suggestion the service recorded in {@code dir}'s database. The
   * service keeps the file while it runs: then nothing is read and {@link Read#unavailable} says
   * so (training goes on without them). No database yet means no feedback.
   */
  public static Read read(DataDir dir, Knowledge knowledge) {
    try {
      var opened = CommandLineDatabase.openIfPresent(dir);
      if (opened.isEmpty()) {
        return new Read(List.of(), Map.of(), null);
      }
      try (Connection c = opened.get()) {
        return pairs(c, knowledge);
      }
    } catch (SQLException e) {
      if (CommandLineDatabase.heldByService(e)) {
        return new Read(List.of(), Map.of(), "the service is running on " + dir.root()
            + " and holds its database (" + CommandLineDatabase.file(dir) + "); stop it and "
            + "train again to learn from agents' feedback");
      }
      return new Read(List.of(), Map.of(), CommandLineDatabase.file(dir) + " could not be read ("
          + e.getMessage() + ")");
    } catch (RuntimeException e) {
      // A migration refused (a damaged or newer file): training does not need the feedback.
      return new Read(List.of(), Map.of(), CommandLineDatabase.file(dir) + " could not be read ("
          + e.getMessage() + ")");
    }
  }

  static Read pairs(Connection c, Knowledge knowledge) throws SQLException {
    Map<String, AnswerGroup> groups = knowledge.grouping().byId();
    TextCleaner cleaner = TextCleaner.standard();
    List<TrainingPair> pairs = new ArrayList<>();
    Map<String, Integer> skipped = new TreeMap<>();
    Set<String> seen = new HashSet<>();
    try (PreparedStatement s = c.prepareStatement("SELECT ticket_id, question, answer_group, "
        + "verdict, final_text, suggested_text FROM suggestion_feedback ORDER BY id");
        ResultSet rs = s.executeQuery()) {
      while (rs.next()) {
        String ticket = rs.getString(1);
        String question = rs.getString(2);
        String verdict = rs.getString(4);
        String text;
        if (verdict.equals("REJECTED")) {
          skipped.merge(REJECTED, 1, Integer::sum);
          continue;
        }
        if (ticket != null && knowledge.tickets().containsKey(ticket)) {
          // Its resolved reply is learned from as a stored ticket (or kept apart for fusion).
          skipped.merge(STORED, 1, Integer::sum);
          continue;
        }
        if (verdict.equals("EDITED")) {
          text = rs.getString(5);
        } else {
          text = rs.getString(6);
          AnswerGroup group = groups.get(rs.getString(3));
          if (text == null && group != null) {
            text = group.canonical();
          }
          if (text == null) {
            skipped.merge(NO_TEXT, 1, Integer::sum);
            continue;
          }
        }
        if (Slots.hasSlots(text)) {
          // The agent filled this customer's details in: what went out is not what was shown.
          skipped.merge(SLOTS, 1, Integer::sum);
          continue;
        }
        // Cleaned as an ingested reply is (greeting, sign-off, signature, quoted mail removed).
        String reply = text == null ? "" : cleaner.cleanReply(text);
        if (question == null || question.isBlank() || reply.isBlank()) {
          skipped.merge(EMPTY, 1, Integer::sum);
          continue;
        }
        if (!seen.add(question + '\u0000' + reply)) {
          skipped.merge(DUPLICATE, 1, Integer::sum);
          continue;
        }
        pairs.add(new TrainingPair(question, reply));
      }
    }
    return new Read(List.copyOf(pairs), java.util.Collections.unmodifiableMap(skipped), null);
  }
}
