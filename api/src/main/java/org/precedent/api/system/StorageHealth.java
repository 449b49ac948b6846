package org.precedent.api.system;

import java.sql.Timestamp;
import java.time.Instant;
import org.springframework.boot.actuate.health.Health;
import org.springframework.boot.actuate.health.HealthIndicator;
import org.springframework.dao.DuplicateKeyException;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Component;

/**
 * The {@code db} part of {@code /actuator/health}, in place of Spring Boot's: it writes and
 * commits one row, since a database that can still be read may no longer be able to store a
 * ticket (a full disk), and only a write shows that. DOWN, with the reason, while it fails.
 */
@Component("dbHealthIndicator")
class StorageHealth implements HealthIndicator {
  private final JdbcTemplate db;

  StorageHealth(JdbcTemplate db) {
    this.db = db;
  }

  @Override
  public Health health() {
    try {
      // Each statement commits on its own (auto-commit): no transaction to roll back on a
      // database that is failing.
      Timestamp now = Timestamp.from(Instant.now());
      if (db.update("UPDATE storage_probe SET probed_at = ? WHERE id = 1", now) == 0) {
        try {
          db.update("INSERT INTO storage_probe (id, probed_at) VALUES (1, ?)", now);
        } catch (DuplicateKeyException probedAtTheSameTime) {
          // Another check wrote the row first: that write succeeded all the same.
        }
      }
      return Health.up().withDetail("writes", "a row was written and committed").build();
    } catch (RuntimeException e) {
      return Health.down().withDetail("error", StorageFailures.describe(e)).build();
    }
  }
}
