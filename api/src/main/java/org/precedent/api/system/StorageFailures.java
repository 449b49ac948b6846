package org.precedent.api.system;

import java.io.IOException;
import java.sql.SQLException;
import java.util.Set;
import org.springframework.dao.DataAccessResourceFailureException;
import org.springframework.dao.TransientDataAccessResourceException;
import org.springframework.transaction.CannotCreateTransactionException;
import org.springframework.transaction.TransactionSystemException;

/**
 * Tells a failure of the service's storage (the disk is full, the database file cannot be written,
 * the database closed itself after such a failure, no connection can be had) from any other error.
 * Such a failure is the service's, not the request's: the request can be sent again once storage
 * works, so it is answered 503, and the health check reports the database DOWN meanwhile.
 */
public final class StorageFailures {
  /**
   * H2's codes (org.h2.api.ErrorCode) for a database that cannot be read or written: IO_EXCEPTION_1,
   * IO_EXCEPTION_2, FILE_CORRUPTED_1, CONNECTION_BROKEN_1, DATABASE_IS_CLOSED,
   * DATABASE_CALLED_AT_SHUTDOWN. Plain numbers, so that another database needs no H2 classes.
   */
  static final Set<Integer> H2_CODES = Set.of(90028, 90031, 90030, 90067, 90098, 90121);

  private StorageFailures() {}

  /** Whether {@code e}, or anything that caused it, is a failure of storage. */
  public static boolean isStorageFailure(Throwable e) {
    for (Throwable t = e; t != null; t = t.getCause() == t ? null : t.getCause()) {
      if (t instanceof DataAccessResourceFailureException
          || t instanceof TransientDataAccessResourceException || t instanceof IOException) {
        return true;
      }
      if (t instanceof SQLException s && (brokenConnection(s) || outOfResources(s))) {
        return true;
      }
      if (t instanceof CannotCreateTransactionException) {
        return true; // no connection to begin a transaction on
      }
      // A rollback that failed after the statement did: the pool's "Connection is closed" (no
      // SQL state) is its cause, and the database's own error is the application's exception.
      if (t instanceof TransactionSystemException s && s.getApplicationException() != null
          && isStorageFailure(s.getApplicationException())) {
        return true;
      }
    }
    return false;
  }

  /**
   * Whether the connection that raised {@code s} is of no further use: the database behind it
   * closed or could not write its file. H2 closes the whole database when a write fails (a full
   * disk), and its connections keep answering "closed" until replaced.
   */
  static boolean brokenConnection(SQLException s) {
    if (H2_CODES.contains(s.getErrorCode())) {
      return true;
    }
    String state = s.getSQLState();
    if (state != null && state.startsWith("08")) {
      return true; // SQL standard class 08: connection exception
    }
    if (state != null && state.startsWith("57P")) {
      // PostgreSQL's operator intervention on the server as a whole (its errcodes appendix):
      // admin_shutdown, crash_shutdown, cannot_connect_now (starting up), database_dropped,
      // idle_session_timeout. Such a connection is ended; 57014 (a cancelled query) is not.
      return true;
    }
    for (Throwable t = s.getCause(); t != null; t = t.getCause() == t ? null : t.getCause()) {
      if (t instanceof IOException) {
        return true;
      }
    }
    return false;
  }

  // SQL standard class 53, insufficient resources: PostgreSQL's disk_full is 53100.
  private static boolean outOfResources(SQLException s) {
    return s.getSQLState() != null && s.getSQLState().startsWith("53");
  }

  /**
   * What went wrong, for a health detail or a log line: the input/output error if there is one
   * among the causes ("No space left on device"), else the innermost cause.
   */
  public static String describe(Throwable e) {
    Throwable root = e;
    while (!(root instanceof IOException) && root.getCause() != null && root.getCause() != root) {
      root = root.getCause();
    }
    String message = root.getMessage();
    return root.getClass().getSimpleName()
        + (message == null ? "" : ": " + message.strip().split("\n", 2)[0]);
  }
}
