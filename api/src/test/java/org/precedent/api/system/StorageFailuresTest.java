package org.precedent.api.system;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.sql.SQLException;
import org.junit.jupiter.api.Test;
import org.springframework.transaction.CannotCreateTransactionException;
import org.springframework.transaction.TransactionSystemException;

/**
 * What counts as the database failing, as PostgreSQL and the pool report it when the server stops
 * (the states as seen in {@code QueueDatabaseOutageTest}'s run).
 */
class StorageFailuresTest {
  @Test
  void aServerShuttingDownIsAStorageFailureAndACancelledQueryIsNot() {
    // SQL states from the PostgreSQL documentation, Appendix A "PostgreSQL Error Codes":
    // 57P01 admin_shutdown, 57P03 cannot_connect_now, 57014 query_canceled.
    assertTrue(StorageFailures.isStorageFailure(new SQLException(
        "FATAL: terminating connection due to administrator command", "57P01")));
    assertTrue(StorageFailures.isStorageFailure(new SQLException(
        "FATAL: the database system is starting up", "57P03")));
    assertFalse(StorageFailures.isStorageFailure(new SQLException(
        "canceling statement due to user request", "57014")));
  }

  @Test
  void aRollbackThatFailedAfterTheDatabaseWentAwayIsAStorageFailure() {
    // HikariCP's closed connection answers "Connection is closed" without a state; the database's
    // own error is the transaction's application exception.
    TransactionSystemException rollback = new TransactionSystemException("JDBC rollback failed",
        new SQLException("Connection is closed"));
    assertFalse(StorageFailures.isStorageFailure(rollback));
    rollback.initApplicationException(new SQLException(
        "FATAL: terminating connection due to administrator command", "57P01"));
    assertTrue(StorageFailures.isStorageFailure(rollback));
    assertTrue(StorageFailures.isStorageFailure(new CannotCreateTransactionException(
        "Could not open JDBC Connection for transaction")));
  }
}
