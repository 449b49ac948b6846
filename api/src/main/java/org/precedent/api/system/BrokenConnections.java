package org.precedent.api.system;

import com.zaxxer.hikari.SQLExceptionOverride;
import java.sql.SQLException;

/**
 * Tells the connection pool to drop a connection whose database closed or failed to write its
 * file, so that the next connection opens the database afresh once storage works again. The
 * pool's own test keeps such an H2 connection: it still reports itself valid. Named in
 * {@code spring.datasource.hikari.exception-override-class-name}.
 */
public final class BrokenConnections implements SQLExceptionOverride {
  @java.lang.Override
  public SQLExceptionOverride.Override adjudicate(SQLException e) {
    return StorageFailures.brokenConnection(e) ? SQLExceptionOverride.Override.MUST_EVICT
        : SQLExceptionOverride.Override.CONTINUE_EVICT;
  }
}
