package org.precedent.api.system;

import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.util.Optional;
import org.precedent.knowledge.store.DataDir;
import org.springframework.jdbc.datasource.SingleConnectionDataSource;

/**
 * The command line's door to the service's database in the data directory ({@link
 * DataDir#serviceDatabase}): the H2 file the service keeps, opened by a command when the service
 * does not hold it (the file admits one process), with the service's migrations run first so
 * that the command finds the tables the service would.
 */
public final class CommandLineDatabase {
  /** H2's DATABASE_ALREADY_OPEN_1 (org.h2.api.ErrorCode): another process holds the file. */
  private static final int DATABASE_ALREADY_OPEN = 90020;

  private CommandLineDatabase() {}

  /** Opens the database, making it (a private directory, then the file) if it is not there yet. */
  public static Connection open(DataDir dir) throws SQLException, java.io.IOException {
    org.precedent.knowledge.io.AtomicFiles.createPrivateDirectories(
        dir.serviceDatabase().getParent());
    return migrated(DriverManager.getConnection(url(dir, false), "sa", ""));
  }

  /** Opens the database if the service ever made it; empty when there is no file. */
  public static Optional<Connection> openIfPresent(DataDir dir) throws SQLException {
    if (!Files.exists(file(dir))) {
      return Optional.empty();
    }
    return Optional.of(migrated(DriverManager.getConnection(url(dir, true), "sa", "")));
  }

  /** The file H2 keeps the database in. */
  public static Path file(DataDir dir) {
    return Path.of(dir.serviceDatabase() + ".mv.db");
  }

  /** Whether the failure is that another process (the service, running) holds the file. */
  public static boolean heldByService(SQLException e) {
    return e.getErrorCode() == DATABASE_ALREADY_OPEN;
  }

  private static String url(DataDir dir, boolean onlyIfExists) {
    return "jdbc:h2:file:" + dir.serviceDatabase() + ";WRITE_DELAY=0"
        + (onlyIfExists ? ";IFEXISTS=TRUE" : "");
  }

  private static Connection migrated(Connection c) {
    try {
      // The same migrations as the service's own start runs.
      ServiceSchema.migrate(new SingleConnectionDataSource(c, true));
      return c;
    } catch (RuntimeException e) {
      try {
        c.close();
      } catch (SQLException closing) {
        e.addSuppressed(closing);
      }
      throw e;
    }
  }
}
