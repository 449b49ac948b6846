package org.precedent.engine.evaluate;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The "changes since the earlier report" section: for each system present in both reports, each
 * measure's earlier value, new value and difference. Systems are matched by name.
 */
final class Changes {
  private Changes() {}

  /** One measure of one system in both reports. */
  record Row(String system, Measure measure, double before, double after) {
    double difference() {
      return after - before;
    }
  }

  static List<Row> rows(EvaluationReport previous, EvaluationReport current) {
    Map<String, SystemReport> earlier = byName(previous);
    List<Row> rows = new ArrayList<>();
    for (SystemReport now : current.systems()) {
      SystemReport then = earlier.get(now.name());
      if (then == null) {
        continue;
      }
      for (Measure m : Measure.values()) {
        rows.add(new Row(now.name(), m, m.of(then), m.of(now)));
      }
    }
    return rows;
  }

  static String html(EvaluationReport previous, EvaluationReport current) {
    StringBuilder out = new StringBuilder();
    out.append("<section id=\"changes\"><h2>Changes since the earlier report</h2>\n<p class=\"lead\">Earlier report: ")
        .append(Html.escape(previous.dataset())).append(", ").append(Html.count(previous.tickets()))
        .append(" tickets, built ").append(Html.escape(HtmlReport.date(previous.createdAt()))).append(".</p>\n");
    if (!previous.dataset().equals(current.dataset()) || previous.tickets() != current.tickets()) {
      out.append("<p class=\"warn\">The two reports used different held-out tickets, so part of any change "
          + "may come from the tickets rather than the systems.</p>\n");
    }
    Map<String, SystemReport> earlier = byName(previous);
    Map<String, SystemReport> now = byName(current);
    List<String> added = now.keySet().stream().filter(n -> !earlier.containsKey(n)).toList();
    List<String> dropped = earlier.keySet().stream().filter(n -> !now.containsKey(n)).toList();
    if (!added.isEmpty()) {
      out.append("<p>New in this report: ").append(names(added)).append(".</p>\n");
    }
    if (!dropped.isEmpty()) {
      out.append("<p>No longer reported: ").append(names(dropped)).append(".</p>\n");
    }
    List<Row> rows = rows(previous, current);
    if (rows.isEmpty()) {
      out.append("<p>No system appears in both reports, so there is nothing to compare.</p>\n");
    }
    String system = null;
    for (Row r : rows) {
      if (!r.system().equals(system)) {
        if (system != null) {
          out.append("</tbody></table>\n");
        }
        system = r.system();
        out.append("<h3>").append(Html.escape(system)).append("</h3>\n<table class=\"changes\"><thead><tr>"
            + "<th scope=\"col\">Measure</th><th scope=\"col\">Earlier</th><th scope=\"col\">Now</th>"
            + "<th scope=\"col\">Change</th></tr></thead><tbody>\n");
      }
      out.append("<tr><th scope=\"row\">").append(Html.escape(r.measure().label)).append("</th><td>")
          .append(r.measure().format(r.before())).append("</td><td>").append(r.measure().format(r.after()))
          .append("</td>").append(changeCell(r)).append("</tr>\n");
    }
    if (system != null) {
      out.append("</tbody></table>\n");
    }
    return out.append("</section>\n").toString();
  }

  /** Arrow for the direction of the number, word and colour for whether that is good news. */
  private static String changeCell(Row r) {
    double d = r.difference();
    Measure m = r.measure();
    if (Double.isNaN(d)) {
      return "<td class=\"same\">" + Html.NOT_AVAILABLE + "</td>";
    }
    if (m.negligible(d)) {
      return "<td class=\"same\">= no change</td>";
    }
    boolean better = m.better(r.after(), r.before());
    String arrow = d > 0 ? "\u25B2" : "\u25BC";
    return "<td class=\"" + (better ? "better" : "worse") + "\">" + arrow + " " + m.formatDifference(d)
        + " <span class=\"verdict\">" + (better ? "better" : "worse") + "</span></td>";
  }

  private static String names(List<String> names) {
    return String.join(", ", names.stream().map(Html::escape).toList());
  }

  private static Map<String, SystemReport> byName(EvaluationReport report) {
    Map<String, SystemReport> out = new LinkedHashMap<>();
    for (SystemReport s : report.systems()) {
      out.put(s.name(), s);
    }
    return out;
  }
}
