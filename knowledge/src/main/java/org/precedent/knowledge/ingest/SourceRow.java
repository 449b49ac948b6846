package org.precedent.knowledge.ingest;

import java.util.Map;

/**
 * One record of an export as read, before validation.
 *
 * @param line   the line the record starts on (1-based)
 * @param values column name to raw value
 * @param error  why the record could not be parsed at all (bad JSON on one line), or null
 */
record SourceRow(long line, Map<String, String> values, String error) {
  static SourceRow parsed(long line, Map<String, String> values) {
    return new SourceRow(line, values, null);
  }

  static SourceRow unreadable(long line, String error) {
    return new SourceRow(line, Map.of(), error);
  }
}
