package org.precedent.api.answers;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.function.Function;
import javax.sql.DataSource;
import org.junit.jupiter.api.Test;
import org.precedent.api.system.ServiceSchema;
import org.precedent.api.testing.TrainedData;
import org.precedent.engine.decide.Decision;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.decide.Outcome;
import org.precedent.engine.decide.Pipeline;
import org.precedent.engine.decide.Thresholds;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.group.AnswerGroup;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.group.Grouping;
import org.precedent.knowledge.ingest.ColumnMapping;
import org.precedent.knowledge.ingest.ExportFormat;
import org.precedent.knowledge.ingest.Ingestor;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.ticket.Ticket;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.jdbc.datasource.DataSourceTransactionManager;
import org.springframework.jdbc.datasource.DriverManagerDataSource;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * The library on the demo data: how many answers and templates grouping drafts, and the coverage
 * and precision at the threshold with and without the approval gate. The truth of a held-out
 * ticket is the group its own reply reuses (the evaluation's rule, HeldOutEvaluation.truth).
 */
class LibraryCoverageTest {
  private static AnswerLibrary library() {
    DataSource h2 = new DriverManagerDataSource("jdbc:h2:mem:coverage" + System.nanoTime()
        + ";DB_CLOSE_DELAY=-1", "sa", "");
    ServiceSchema.migrate(h2);
    return new AnswerLibrary(new JdbcTemplate(h2),
        new TransactionTemplate(new DataSourceTransactionManager(h2)));
  }

  private static Ingestor.ParsedExport parse(Path data, String file) throws Exception {
    Path demo = TrainedData.root().resolve("demo-data");
    Ingestor ingestor = new Ingestor(new DataDir(data), TextCleaner.standard(),
        AnswerGrouper.standard());
    return ingestor.parse(demo.resolve(file), ExportFormat.CSV, ColumnMapping.fromFile(
        demo.resolve("mapping.properties"), Map.of()), Progress.silent());
  }

  @Test
  void everyGroupOfTheDemoDataIsOneDraftedAnswer() throws Exception {
    Path scratch = Files.createTempDirectory("precedent-library-");
    try {
      List<Ticket> all = parse(scratch, "tickets.csv").tickets();
      Grouping grouping = AnswerGrouper.standard().group(all);
      AnswerLibrary library = library();
      library.sync("demo", grouping);
      List<StoredAnswer> answers = library.list(null, null);
      long templates = answers.stream().filter(a -> !a.slots().isEmpty()).count();
      System.err.printf("library benchmark: demo %d tickets, %d answers drafted, %d of them "
          + "templates, 0 approved%n", all.size(), answers.size(), templates);
      assertEquals(grouping.groups().size(), answers.size());
      assertEquals(grouping.groups().stream().filter(g -> g.template() != null).count(),
          templates);
    } finally {
      TrainedData.delete(scratch);
    }
  }

  @Test
  void withNoApprovalsTheGateSendsNothingAndApprovingTheMostUsedBringsCoverageBack()
      throws Exception {
    Path data = TrainedData.copy();
    try (InForce active = InForce.open(new DataDir(data))) {
      Grouping grouping = active.knowledge().grouping();
      AnswerLibrary library = library();
      library.sync("test", grouping);
      List<StoredAnswer> answers = library.list(null, null);
      Function<String, Optional<AnswerGroup>> truth = AnswerGrouper.standard().matcher(grouping);
      // A held-out ticket is one the tiny model never saw (TrainedData ingests the first 600).
      List<Ticket> heldOut = parse(data, "heldout.csv").tickets().subList(0, 200);
      for (double threshold : new double[] {InForce.DEFAULT_THRESHOLD, 0.5}) {
        Pipeline p = active.pipeline().withThresholds(new Thresholds(threshold, Map.of()));
        List<LibraryCoverage.Asked> asked = new ArrayList<>();
        for (Ticket t : heldOut) {
          Decision d = p.decide(t.question(), t.category());
          String right = truth.apply(t.reply()).map(AnswerGroup::id).orElse(null);
          asked.add(new LibraryCoverage.Asked(d.answerGroup(), d.outcome() == Outcome.REPLY,
              right != null && right.equals(d.answerGroup())));
        }
        LibraryCoverage.Figures ungated = LibraryCoverage.of(asked, id -> true);
        LibraryCoverage.Figures none = LibraryCoverage.of(asked, id -> false);
        StringBuilder line = new StringBuilder(String.format(java.util.Locale.ROOT,
            "library benchmark: threshold %.2f, %d held-out tickets: without the gate coverage "
                + "%.3f precision %.3f; gate with 0 approved coverage %.3f", threshold,
            asked.size(), ungated.coverage(), ungated.precision(), none.coverage()));
        for (int n : new int[] {5, 10, 20, answers.size()}) {
          Set<String> top = LibraryCoverage.mostUsed(answers, n);
          LibraryCoverage.Figures f = LibraryCoverage.of(asked, top::contains);
          line.append(String.format(java.util.Locale.ROOT, "; top %d approved coverage %.3f "
              + "precision %.3f", n, f.coverage(), f.precision()));
          assertTrue(f.replied() <= ungated.replied());
        }
        System.err.println(line);
        assertEquals(0, none.replied());
        // Approving every answer gives back exactly what the pipeline alone sends.
        assertEquals(ungated, LibraryCoverage.of(asked,
            LibraryCoverage.mostUsed(answers, answers.size())::contains));
      }
    } finally {
      TrainedData.delete(data);
    }
  }
}
