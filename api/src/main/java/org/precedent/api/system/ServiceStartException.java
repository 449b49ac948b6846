package org.precedent.api.system;

import java.sql.SQLException;
import org.springframework.beans.BeansException;
import org.springframework.context.ApplicationContextException;

/**
 * The service could not start. The message says what is at fault (the file, and what is wrong with
 * it) in one line, not the framework's chain of wrappers around it; the cause keeps the whole story
 * for the log.
 */
public final class ServiceStartException extends RuntimeException {
  ServiceStartException(String message, Throwable cause) {
    super(message, cause);
  }

  /** The failure of a start, said by the part that failed. */
  static ServiceStartException of(Throwable failure) {
    for (Throwable t = failure; t != null; t = t.getCause()) {
      if (t instanceof ServiceStartException s) {
        return s;
      }
    }
    for (Throwable t = failure; t != null; t = t.getCause()) {
      if (t instanceof SQLException sql) {
        // The database's own message names the file (H2) or the server it could not reach.
        return new ServiceStartException("the service database cannot be used: "
            + firstLine(sql), failure);
      }
    }
    Throwable t = failure;
    while ((t instanceof BeansException || t instanceof ApplicationContextException)
        && t.getCause() != null) {
      t = t.getCause();
    }
    return new ServiceStartException(firstLine(t), failure);
  }

  private static String firstLine(Throwable t) {
    String m = t.getMessage();
    if (m == null || m.isBlank()) {
      return t.getClass().getSimpleName();
    }
    int cut = m.indexOf('\n');
    return cut < 0 ? m : m.substring(0, cut);
  }
}
