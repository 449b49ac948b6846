package org.precedent.api.answers;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import javax.sql.DataSource;
import org.junit.jupiter.api.extension.RegisterExtension;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.precedent.api.system.ServiceSchema;
import org.precedent.api.testing.PostgresForClass;
import org.precedent.knowledge.group.AnswerGroup;
import org.precedent.knowledge.group.Grouping;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.jdbc.datasource.DataSourceTransactionManager;
import org.springframework.jdbc.datasource.DriverManagerDataSource;
import org.springframework.transaction.support.TransactionTemplate;

/** The library on both databases the service runs on: H2 (the default) and PostgreSQL. */
class AnswerLibraryTest {
  @RegisterExtension
  static final PostgresForClass postgres = new PostgresForClass();

  private static final AnswerGroup BIN = new AnswerGroup("a-bin", "Your bin is collected on "
      + "Tuesday mornings; put it out by seven.", null, "waste", List.of("T-1", "T-2", "T-3"));
  private static final AnswerGroup METER = new AnswerGroup("a-meter", "Read the meter from left "
      + "to right and ignore the red digits.", null, "water", List.of("T-4", "T-5", "T-6"));

  private static DataSource database(String which) {
    if (which.equals("postgres")) {
      ServiceSchema.migrate(postgres.dataSource());
      postgres.reset();
      return postgres.dataSource();
    }
    DataSource h2 = new DriverManagerDataSource("jdbc:h2:mem:library" + System.nanoTime()
        + ";DB_CLOSE_DELAY=-1", "sa", "");
    ServiceSchema.migrate(h2);
    return h2;
  }

  private static AnswerLibrary library(DataSource db) {
    return new AnswerLibrary(new JdbcTemplate(db),
        new TransactionTemplate(new DataSourceTransactionManager(db)));
  }

  private static Grouping grouping(AnswerGroup... groups) {
    return new Grouping(List.of(groups), List.of(), "replies");
  }

  @ParameterizedTest
  @ValueSource(strings = {"h2", "postgres"})
  void groupsBecomeDraftsAndChangesAreVersionedAndAudited(String which) {
    AnswerLibrary library = library(database(which));
    AnswerLibrary.SyncReport first = library.sync("gen-000001", grouping(BIN, METER));
    assertEquals(2, first.created());
    StoredAnswer bin = library.find("a-bin").orElseThrow();
    assertEquals("DRAFTED", bin.state());
    assertEquals(1, bin.version());
    assertEquals(BIN.canonical(), bin.text());
    assertEquals(List.of("T-1", "T-2", "T-3"), bin.sources());
    assertTrue(bin.title().startsWith("waste — "), bin.title());

    StoredAnswer edited = library.edit("a-bin", 1, "Bin day", "Bins go out by 7am on Tuesday.",
        "manager", "plainer");
    assertEquals(2, edited.version());
    assertTrue(edited.edited());
    StoredAnswer approved = library.approve("a-bin", 2, "manager", "checked with the depot");
    assertEquals("APPROVED", approved.state());
    assertEquals("Bins go out by 7am on Tuesday.", approved.text());

    // A change made on a version someone else already changed is refused, and changes nothing.
    assertThrows(AnswerLibrary.Conflict.class,
        () -> library.retire("a-bin", 2, "other", "stale"));
    assertThrows(AnswerLibrary.UnknownAnswer.class,
        () -> library.approve("a-none", 1, "manager", "x"));
    assertEquals(3, library.find("a-bin").orElseThrow().version());

    List<AnswerChange> audit = library.changes("a-bin", 100);
    assertEquals(List.of("APPROVED", "EDITED", "CREATED"),
        audit.stream().map(AnswerChange::action).toList());
    AnswerChange edit = audit.get(1);
    assertEquals(BIN.canonical(), edit.oldText());
    assertEquals("Bins go out by 7am on Tuesday.", edit.newText());
    assertEquals("plainer", edit.reason());
    assertEquals("manager", edit.changedBy());
    assertEquals(1, library.list("tuesday", null).size());
    assertEquals(1, library.list(null, StoredAnswer.State.APPROVED).size());
    // A search is for the text typed: a wild card matches only itself.
    assertEquals(0, library.list("%", null).size());
  }

  @ParameterizedTest
  @ValueSource(strings = {"h2", "postgres"})
  void aNewGenerationKeepsWhatPeopleDecidedAndSaysWhatChangedUnderneath(String which) {
    AnswerLibrary library = library(database(which));
    library.sync("gen-000001", grouping(BIN, METER));
    library.approve("a-bin", 1, "manager", "fine as it is");
    AnswerGroup moreBins = new AnswerGroup("a-bin", BIN.canonical(), null, "waste",
        List.of("T-1", "T-2", "T-3", "T-9"));
    AnswerGroup moreMeters = new AnswerGroup("a-meter", METER.canonical(), null, "water",
        List.of("T-4", "T-5", "T-6", "T-8"));
    AnswerLibrary.SyncReport second = library.sync("gen-000002", grouping(moreBins, moreMeters));
    assertEquals(0, second.created());
    assertEquals(List.of("a-bin"), second.changedUnderneath());
    assertEquals(List.of("a-meter"), second.refreshed());
    StoredAnswer bin = library.find("a-bin").orElseThrow();
    assertEquals("APPROVED", bin.state());
    assertTrue(bin.changedUnderneath());
    assertEquals(4, bin.sources().size());

    // A group that is gone leaves its answer, marked absent; it cannot be approved.
    AnswerLibrary.SyncReport third = library.sync("gen-000003", grouping(moreBins));
    assertEquals(List.of("a-meter"), third.gone());
    StoredAnswer meter = library.find("a-meter").orElseThrow();
    assertFalse(meter.present());
    assertThrows(AnswerLibrary.Conflict.class,
        () -> library.approve("a-meter", meter.version(), "manager", "x"));
    // Approving clears the mark: a manager looked at it again.
    assertFalse(library.approve("a-bin", bin.version(), "manager", "rechecked")
        .changedUnderneath());
  }

  @ParameterizedTest
  @ValueSource(strings = {"h2", "postgres"})
  void ofTwoEditsMadeOnOneVersionExactlyOneIsKept(String which) throws Exception {
    AnswerLibrary library = library(database(which));
    library.sync("gen-000001", grouping(BIN));
    ExecutorService pool = Executors.newFixedThreadPool(4);
    CountDownLatch start = new CountDownLatch(1);
    List<Future<Boolean>> tries = new ArrayList<>();
    for (int i = 0; i < 4; i++) {
      int n = i;
      Callable<Boolean> edit = () -> {
        start.await();
        try {
          library.edit("a-bin", 1, "Bin day " + n, "Text " + n, "m" + n, "edit " + n);
          return true;
        } catch (AnswerLibrary.Conflict e) {
          return false;
        }
      };
      tries.add(pool.submit(edit));
    }
    start.countDown();
    int kept = 0;
    for (Future<Boolean> f : tries) {
      kept += f.get() ? 1 : 0;
    }
    pool.shutdown();
    assertEquals(1, kept);
    assertEquals(2, library.find("a-bin").orElseThrow().version());
    assertEquals(1, library.changes("a-bin", 100).stream()
        .filter(c -> c.action().equals("EDITED")).count());
  }
}
