package org.precedent.api.threshold;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.decide.Thresholds;
import org.precedent.knowledge.store.DataDir;

/**
 * A threshold changed from the command line is recorded in the same audit table the manager page
 * lists, in the service's own database file; when that cannot be done, nothing changes.
 */
class ThresholdAuditTest {
  @TempDir
  Path tmp;

  private static List<String> rows(DataDir dir) throws Exception {
    List<String> rows = new ArrayList<>();
    try (Connection c = DriverManager.getConnection("jdbc:h2:file:" + dir.serviceDatabase(), "sa",
        "");
        ResultSet rs = c.createStatement().executeQuery("SELECT changed_by, old_value, "
            + "new_value, reason FROM threshold_change ORDER BY id")) {
      while (rs.next()) {
        rows.add(rs.getString(1) + " | " + rs.getString(2) + " | " + rs.getString(3) + " | "
            + rs.getString(4));
      }
    }
    return rows;
  }

  @Test
  void aCommandLineChangeIsInForceAndAudited() throws Exception {
    DataDir dir = new DataDir(tmp.resolve("data"));
    ThresholdAudit.applyFromCommandLine(dir, new Thresholds(0.93, Map.of("billing", 0.99)),
        "sam (command line)", "from the evaluation of May");
    assertEquals(new Thresholds(0.93, Map.of("billing", 0.99)), InForce.readThresholds(dir));
    ThresholdAudit.applyFromCommandLine(dir, Thresholds.global(0.9), "sam (command line)",
        "billing is fine now");
    assertEquals(List.of(
        "sam (command line) | global=0.9500 | global=0.9300; billing=0.9900 | from the evaluation "
            + "of May",
        "sam (command line) | global=0.9300; billing=0.9900 | global=0.9000 | billing is fine now"),
        rows(dir));
    // The row the service puts in force at its start holds the command line's change too.
    try (Connection c = DriverManager.getConnection("jdbc:h2:file:" + dir.serviceDatabase(), "sa",
        "");
        ResultSet rs = c.createStatement().executeQuery("SELECT content, revision FROM "
            + "shared_in_force WHERE name = 'thresholds'")) {
      assertTrue(rs.next());
      assertEquals(Thresholds.global(0.9), new com.fasterxml.jackson.databind.ObjectMapper()
          .readValue(rs.getString(1), Thresholds.class));
      assertEquals(2, rs.getLong(2));
    }
    // The audit sits with customers' data: owner-only, as the service keeps its files.
    if (Files.getFileStore(tmp).supportsFileAttributeView("posix")) {
      assertEquals("rwx------", java.nio.file.attribute.PosixFilePermissions.toString(
          Files.getPosixFilePermissions(dir.serviceDatabase().getParent())));
      assertEquals("rw-------", java.nio.file.attribute.PosixFilePermissions.toString(
          Files.getPosixFilePermissions(Path.of(dir.serviceDatabase() + ".mv.db"))));
    }
  }

  @Test
  void aDamagedDatabaseRefusesTheChangeAndLeavesTheThresholdAsItWas() throws Exception {
    DataDir dir = new DataDir(tmp.resolve("data"));
    Files.createDirectories(dir.serviceDatabase().getParent());
    Files.writeString(Path.of(dir.serviceDatabase() + ".mv.db"), "not a database at all");
    IOException e = assertThrows(IOException.class, () -> ThresholdAudit.applyFromCommandLine(
        dir, Thresholds.global(0.5), "sam", "lower"));
    assertTrue(e.getMessage().contains("precedent.mv.db"), e.getMessage());
    assertTrue(e.getMessage().contains("unchanged"), e.getMessage());
    assertEquals(Thresholds.global(InForce.DEFAULT_THRESHOLD), InForce.readThresholds(dir));
    assertTrue(Files.notExists(dir.thresholds()), "no thresholds file was written");
  }

  @Test
  void aReasonLongerThanTheAuditKeepsIsRefusedAndNothingChanges() throws Exception {
    DataDir dir = new DataDir(tmp.resolve("data"));
    // V1__init.sql gives the reason 2,000 characters; the width is read from the database.
    IOException e = assertThrows(IOException.class, () -> ThresholdAudit.applyFromCommandLine(
        dir, Thresholds.global(0.5), "sam", "x".repeat(2001)));
    assertTrue(e.getMessage().contains("at most 2000 characters"), e.getMessage());
    assertTrue(Files.notExists(dir.thresholds()), "no thresholds file was written");
    assertEquals(List.of(), rows(dir));
  }
}
