package org.precedent.knowledge.ingest;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The records of an export as read, before any validation: for commands that read exports of
 * tickets not yet resolved (no reply), with the same strict reading as ingest.
 */
public final class ExportRows {
  private ExportRows() {}

  /**
   * One record.
   *
   * @param line   the line it starts on (1-based)
   * @param values column name to raw value
   * @param error  why the record could not be parsed (bad JSON on one line), or null
   */
  public record Row(long line, Map<String, String> values, String error) {}

  /**
   * Reads every record of {@code file}.
   *
   * @param requiredColumns columns the header (CSV) or each record (JSON) must have
   * @throws IngestException when the file as a whole cannot be read, saying what and where
   */
  public static List<Row> read(Path file, ExportFormat format, Set<String> requiredColumns)
      throws IngestException {
    ExportReader reader = new ExportReader(file, format);
    reader.checkFile();
    List<Row> rows = new ArrayList<>();
    reader.read(requiredColumns, r -> rows.add(new Row(r.line(), r.values(),
        r.error() == null || r.field() == null ? r.error() : "field " + r.field() + ": " + r.error())),
        s -> { });
    return rows;
  }
}
