package org.precedent.engine.figures;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Measured figures against expected ones: a figure passes when it lies within its tolerance of the
 * expected value, or when both are undefined.
 */
public final class FigureCheck {
  /**
   * Slack for the decimal form of the expected value: 0.1 + 0.2 is 0.30000000000000004, and a
   * figure recorded exactly must pass a tolerance of 0.
   */
  private static final double ROUNDING = 1e-12;

  private FigureCheck() {}

  /**
   * One compared figure.
   *
   * @param measured the measured value; null when the run did not give one, NaN when it is undefined
   */
  public record Row(ExpectedFigures.Figure figure, Double measured, boolean ok) {
    public String status() {
      return ok ? "ok" : "FAIL";
    }
  }

  /** Every expected figure, in the file's order, against {@code measured}. */
  public static List<Row> compare(ExpectedFigures expected, Map<String, Double> measured) {
    List<Row> rows = new ArrayList<>();
    for (ExpectedFigures.Figure f : expected.figures()) {
      Double m = measured.get(f.name());
      rows.add(new Row(f, m, passes(f, m)));
    }
    return rows;
  }

  static boolean passes(ExpectedFigures.Figure f, Double measured) {
    boolean undefined = measured == null || !Double.isFinite(measured);
    if (f.expected() == null) {
      return measured != null && undefined;
    }
    return !undefined && Math.abs(measured - f.expected())
        <= f.tolerance() + ROUNDING * Math.max(1, Math.abs(f.expected()));
  }

  public static boolean allPass(List<Row> rows) {
    return rows.stream().allMatch(Row::ok);
  }

  /** A plain-text table: figure, expected, measured, tolerance, ok or FAIL. */
  public static String table(List<Row> rows) {
    int width = "figure".length();
    for (Row r : rows) {
      width = Math.max(width, r.figure().name().length());
    }
    StringBuilder s = new StringBuilder();
    String line = "%-" + width + "s  %12s  %12s  %10s  %s%n";
    s.append(String.format(Locale.ROOT, line, "figure", "expected", "measured", "tolerance", "result"));
    for (Row r : rows) {
      s.append(String.format(Locale.ROOT, line, r.figure().name(), number(r.figure().expected()),
          r.measured() == null ? "(missing)" : number(r.measured()), number(r.figure().tolerance()),
          r.status()));
    }
    long failed = rows.stream().filter(r -> !r.ok()).count();
    s.append(String.format(Locale.ROOT, "%d of %d figures as expected%s%n", rows.size() - failed,
        rows.size(), failed == 0 ? "" : "; " + failed + " FAIL"));
    return s.toString();
  }

  private static String number(Double v) {
    if (v == null || v.isNaN()) {
      return "undefined";
    }
    if (v == Math.rint(v) && Math.abs(v) < 1e9) {
      return String.format(Locale.ROOT, "%d", v.longValue());
    }
    return String.format(Locale.ROOT, "%.6f", v);
  }
}
