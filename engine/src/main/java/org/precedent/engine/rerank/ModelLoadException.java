package org.precedent.engine.rerank;

/** A saved reranker that cannot be used: missing, corrupt or truncated files, or parts that do not belong together. */
public class ModelLoadException extends RuntimeException {
  public ModelLoadException(String message) {
    super(message);
  }

  public ModelLoadException(String message, Throwable cause) {
    super(message, cause);
  }
}
