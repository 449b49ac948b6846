package org.precedent.knowledge.ingest;

import java.util.Map;

/**
 * One record of an export as read, before validation.
 *
 * @param line   the line the record starts on (1-based)
 * @param values column name to raw value
 * @param error  why the record could not be read (bad JSON on one line, bytes that are not
 *               UTF-8), or null
 * @param field  the column at fault when {@code error} is set, or null for the whole record
 */
record SourceRow(long line, Map<String, String> values, String error, String field) {
  static SourceRow parsed(long line, Map<String, String> values) {
    return new SourceRow(line, values, null, null);
  }

  static SourceRow unreadable(long line, String error) {
    return new SourceRow(line, Map.of(), error, null);
  }

  static SourceRow unreadable(long line, String field, String error) {
    return new SourceRow(line, Map.of(), error, field);
  }
}
