package org.precedent.api.answers;

import java.io.IOException;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Predicate;
import org.precedent.api.system.ServiceSchema;
import org.precedent.engine.evaluate.HeldOutOutcome;
import org.precedent.knowledge.store.DataDir;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.jdbc.datasource.DataSourceTransactionManager;
import org.springframework.jdbc.datasource.SingleConnectionDataSource;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * The held-out evaluation at one threshold both ways: without the approval gate (every answer the
 * pipeline would send counts as an automatic reply) and with it (only those the library lets the
 * queue send, by {@link AnswerGate}'s own rule); and what approving each drafted answer would
 * add, by the held-out tickets it would answer.
 */
public final class ApprovalCoverage {
  /** Held-out ticket ids listed per answer; the count says how many there are in all. */
  static final int IDS_LISTED = 5;

  private ApprovalCoverage() {}

  /**
   * Coverage and precision of automatic replies.
   *
   * @param precision right replies over replies; null when nothing is replied
   */
  public record Shares(int tickets, int replied, int right, double coverage, Double precision) {
    static Shares of(LibraryCoverage.Figures f) {
      return new Shares(f.tickets(), f.replied(), f.right(), f.tickets() == 0 ? 0 : f.coverage(),
          f.replied() == 0 ? null : f.precision());
    }
  }

  /**
   * A drafted answer the pipeline would send to held-out tickets, which the gate holds back.
   *
   * @param tickets   held-out tickets it would answer once approved
   * @param right     of those, the ones it is right for
   * @param ticketIds the first {@value #IDS_LISTED} of them
   */
  public record Addition(String groupId, String title, int tickets, int right,
      List<String> ticketIds) {}

  /**
   * @param withoutGate      every answer the pipeline would send
   * @param withGate         the answers the library lets the queue send now
   * @param afterApproving   with {@code additions} approved too
   * @param additions        most tickets first
   * @param pointsAdded      percentage points of coverage approving them all would add
   */
  public record Report(double threshold, boolean approvalRequired, int approvedAnswers,
      Shares withoutGate, Shares withGate, Shares afterApproving, List<Addition> additions,
      double pointsAdded) {}

  /**
   * The figures at {@code threshold} over the report's held-out outcomes.
   *
   * @param library the library's answers (synced to the knowledge in force)
   */
  public static Report of(List<HeldOutOutcome> outcomes, double threshold,
      List<StoredAnswer> library, boolean approvalRequired) {
    Map<String, StoredAnswer> byGroup = new HashMap<>();
    library.forEach(a -> byGroup.put(a.groupId(), a));
    List<LibraryCoverage.Asked> asked = outcomes.stream().map(o -> new LibraryCoverage.Asked(
        o.answerGroup(), o.replied(threshold), o.right())).toList();
    Predicate<String> sendable = g -> AnswerGate.verdict(byGroup.get(g), approvalRequired)
        .reason() == null;
    // Approvable: a drafted answer of a group still in the knowledge, sendable once approved.
    Predicate<String> approvable = g -> {
      StoredAnswer a = byGroup.get(g);
      return a != null && a.present() && a.state().equals(StoredAnswer.State.DRAFTED.name())
          && !sendable.test(g) && AnswerGate.verdict(approved(a), approvalRequired)
              .reason() == null;
    };
    Map<String, List<HeldOutOutcome>> held = new LinkedHashMap<>();
    for (HeldOutOutcome o : outcomes) {
      if (o.replied(threshold) && approvable.test(o.answerGroup())) {
        held.computeIfAbsent(o.answerGroup(), k -> new ArrayList<>()).add(o);
      }
    }
    List<Addition> additions = new ArrayList<>();
    held.forEach((g, list) -> additions.add(new Addition(g, byGroup.get(g).title(), list.size(),
        (int) list.stream().filter(HeldOutOutcome::right).count(),
        list.stream().limit(IDS_LISTED).map(HeldOutOutcome::ticketId).toList())));
    additions.sort(Comparator.comparingInt((Addition a) -> -a.tickets())
        .thenComparing(Addition::groupId));
    Shares without = Shares.of(LibraryCoverage.of(asked, g -> true));
    Shares with = Shares.of(LibraryCoverage.of(asked, sendable));
    Shares after = Shares.of(LibraryCoverage.of(asked, sendable.or(held::containsKey)));
    int approved = (int) library.stream()
        .filter(a -> a.state().equals(StoredAnswer.State.APPROVED.name())).count();
    return new Report(threshold, approvalRequired, approved, without, with, after,
        List.copyOf(additions), 100 * (after.coverage() - with.coverage()));
  }

  private static StoredAnswer approved(StoredAnswer a) {
    return new StoredAnswer(a.groupId(), a.title(), a.text(), StoredAnswer.State.APPROVED.name(),
        a.version(), a.edited(), a.category(), a.sources(), a.groupText(), a.slots(),
        a.changedUnderneath(), a.present(), a.uses(), a.accepted(), a.editedByAgents(),
        a.rejected(), a.updatedAt());
  }

  /**
   * The library as the command line reads it: from the service's database file in the data
   * directory, synced to the knowledge in force as the service would.
   *
   * @throws IOException when the database cannot be opened (the service holds it) or read
   */
  public static List<StoredAnswer> libraryFromCommandLine(DataDir dir) throws IOException {
    String url = "jdbc:h2:file:" + dir.serviceDatabase() + ";WRITE_DELAY=0";
    org.precedent.knowledge.io.AtomicFiles.createPrivateDirectories(
        dir.serviceDatabase().getParent());
    try (Connection c = DriverManager.getConnection(url, "sa", "")) {
      SingleConnectionDataSource one = new SingleConnectionDataSource(c, true);
      ServiceSchema.migrate(one);
      AnswerLibrary library = new AnswerLibrary(new JdbcTemplate(one),
          new TransactionTemplate(new DataSourceTransactionManager(one)));
      library.syncIfNew(dir);
      return library.list(null, null);
    } catch (SQLException | org.springframework.dao.DataAccessException e) {
      throw new IOException(dir.serviceDatabase() + ".mv.db: the answer library cannot be "
          + "read (" + e.getMessage().lines().findFirst().orElse("") + ")", e);
    } finally {
      org.precedent.knowledge.io.AtomicFiles.makePrivate(dir.serviceDatabase().getParent());
    }
  }
}
