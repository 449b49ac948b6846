package org.precedent.knowledge.ingest;

/**
 * A problem with a whole file (missing, empty, not UTF-8, not text, lacking mapped columns): nothing
 * of it is stored. The message is one line that names the file and, where known, the line.
 */
public final class IngestException extends Exception {
  public IngestException(String message) {
    super(message);
  }

  public IngestException(String message, Throwable cause) {
    super(message, cause);
  }
}
