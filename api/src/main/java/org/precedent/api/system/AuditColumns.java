package org.precedent.api.system;

import java.sql.DatabaseMetaData;
import java.sql.ResultSet;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Component;

/**
 * How much text the audit tables' columns hold, read from the database itself, so that
 * the migrations ({@code db/migration}) are the one place that sets it. A value that does not fit is refused before
 * anything changes, with a problem naming the request's field, rather than failing in the insert.
 */
@Component
public final class AuditColumns {
  private final JdbcTemplate db;
  private final Map<String, Integer> widths = new ConcurrentHashMap<>();

  /** Over the service's database; the command line's door makes one over its own connection. */
  public AuditColumns(JdbcTemplate db) {
    this.db = db;
  }

  /** The longest text {@code table.column} holds, in characters. */
  public int width(String table, String column) {
    return widths.computeIfAbsent(table + "." + column, key -> db.execute(
        (java.sql.Connection c) -> read(c.getMetaData(), table, column)));
  }

  /** Refuses {@code value} for {@code field} when it is longer than {@code table.column} holds. */
  public void check(String field, String value, String table, String column) {
    int width = width(table, column);
    if (value != null && value.length() > width) {
      throw new FieldProblem(field, "must be at most " + width + " characters (the audit record "
          + "keeps no more), got " + value.length());
    }
  }

  private static int read(DatabaseMetaData meta, String table, String column)
      throws java.sql.SQLException {
    // Databases differ in the case they keep names in (H2 upper, PostgreSQL lower).
    for (String t : new String[] {table.toUpperCase(Locale.ROOT), table.toLowerCase(Locale.ROOT)}) {
      try (ResultSet rs = meta.getColumns(null, null, t, null)) {
        while (rs.next()) {
          if (rs.getString("COLUMN_NAME").equalsIgnoreCase(column)) {
            return rs.getInt("COLUMN_SIZE");
          }
        }
      }
    }
    throw new IllegalStateException("the service database has no column " + table + "." + column
        + " (the migrations make it)");
  }
}
