package org.precedent.knowledge.ingest;

/**
 * Why one row of an export was not stored.
 *
 * @param file    the file the row came from
 * @param line    the line the row starts on (1-based)
 * @param field   the mapping key or column at fault, or null when the whole row is at fault
 * @param message what is wrong, in words
 */
public record RowProblem(String file, long line, String field, String message) {
  @Override
  public String toString() {
    return file + ":" + line + (field == null ? "" : ": field " + field) + ": " + message;
  }
}
