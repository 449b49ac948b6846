package org.precedent.api.system;

import javax.sql.DataSource;
import org.flywaydb.core.Flyway;

/**
 * The service's tables, made and upgraded by the Flyway migrations in {@code db/migration}. The
 * service's own start runs them through Spring Boot ({@code spring.flyway.*} in
 * application.properties says the same as here); the command line's door to the audit runs them
 * here, so that a change made before the service ever ran finds the same tables.
 */
public final class ServiceSchema {

  private ServiceSchema() {
  }

  /**
   * Brings the database up to the latest migration. A database made before the migrations has
   * tables and no history: it is baselined at version 0, below V1, so that V1 (written to run
   * over an existing schema) still upgrades it.
   */
  public static void migrate(DataSource database) {
    Flyway.configure()
        .dataSource(database)
        .baselineOnMigrate(true)
        .baselineVersion("0")
        .load()
        .migrate();
  }
}
