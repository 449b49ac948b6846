package org.precedent.engine.evaluate;

import static org.precedent.engine.evaluate.Html.escape;

import java.util.List;
import org.precedent.engine.measure.ThresholdRow;

/** The report's tables. Numbers are right-aligned in tabular figures (see the page style). */
final class ReportTables {
  /** The abbreviated threshold table shows every fifth row of the 0.01 grid: 0.00, 0.05, ..., 1.00. */
  private static final int THRESHOLD_STRIDE = 5;

  private ReportTables() {}

  /** Rows = measures, columns = systems; the best value of each row in bold. */
  static String measures(List<SystemReport> systems) {
    StringBuilder out = new StringBuilder("<div class=\"scroll\"><table class=\"measures\"><thead><tr><th scope=\"col\">Measure</th>");
    systemHeaders(out, systems, 1);
    out.append("</tr></thead><tbody>\n");
    Measure.Group group = null;
    for (Measure m : Measure.values()) {
      if (m.group != group) {
        group = m.group;
        out.append("<tr class=\"group\"><th scope=\"rowgroup\" colspan=\"").append(systems.size() + 1).append("\">")
            .append(escape(group.heading)).append("</th></tr>\n");
      }
      out.append("<tr><th scope=\"row\">").append(escape(m.label))
          .append(m.higherIsBetter ? "" : " <span class=\"hint\">(lower is better)</span>").append("</th>");
      double best = Double.NaN;
      for (SystemReport s : systems) {
        if (m.better(m.of(s), best)) {
          best = m.of(s);
        }
      }
      for (SystemReport s : systems) {
        double v = m.of(s);
        // Only a real comparison earns emphasis: with one system there is nothing to be best among.
        boolean emphasise = systems.size() > 1 && !Double.isNaN(v) && Double.compare(v, best) == 0;
        out.append(emphasise ? "<td class=\"best\"><strong>" + m.format(v) + "</strong></td>"
            : "<td>" + m.format(v) + "</td>");
      }
      out.append("</tr>\n");
    }
    return out.append("</tbody></table></div>\n<p class=\"hint\">Bold: best value in the row.</p>\n").toString();
  }

  /** Thresholds 0.00, 0.05, ..., 1.00; per system share answered, precision with interval, wrong per 1,000. */
  static String thresholds(List<SystemReport> systems) {
    StringBuilder out = new StringBuilder("<div class=\"scroll\"><table class=\"thresholds\"><thead><tr><th scope=\"col\" rowspan=\"2\">"
        + "Reply when confidence \u2265</th>");
    systemHeaders(out, systems, 3);
    out.append("</tr><tr>");
    for (int i = 0; i < systems.size(); i++) {
      out.append("<th scope=\"col\" class=\"first\">Answered</th><th scope=\"col\">Precision, 95% interval</th>"
          + "<th scope=\"col\">Wrong per 1,000</th>");
    }
    out.append("</tr></thead><tbody>\n");
    int rows = systems.get(0).thresholds().size();
    for (int r = 0; r < rows; r += THRESHOLD_STRIDE) {
      out.append("<tr><th scope=\"row\">").append(Html.decimal(systems.get(0).thresholds().get(r).threshold(), 2))
          .append("</th>");
      for (SystemReport s : systems) {
        ThresholdRow row = s.thresholds().get(r);
        out.append("<td class=\"first\">").append(Html.percent(row.answeredShare())).append("</td><td>");
        if (row.answered() == 0) {
          out.append("none answered");
        } else {
          out.append(Html.percent(row.precision())).append(" <span class=\"interval\">(")
              .append(Html.decimal(100 * row.precisionLower(), 1)).append("\u2013")
              .append(Html.decimal(100 * row.precisionUpper(), 1)).append(")</span>");
        }
        out.append("</td><td>").append(Html.decimal(row.wrongPerThousand(), 1)).append("</td>");
      }
      out.append("</tr>\n");
    }
    return out.append("</tbody></table></div>\n").toString();
  }

  /** Categories as rows; per system top-1, share answered and precision at that system's threshold. */
  static String categories(List<SystemReport> systems) {
    StringBuilder out = new StringBuilder("<ul class=\"basis\">\n");
    for (SystemReport s : systems) {
      CategoryTable t = s.categories();
      out.append("<li><b>").append(escape(s.name())).append("</b>: confidence \u2265 ")
          .append(Html.thresholdUp(t.threshold())).append(", ").append(basis(t.basis())).append("</li>\n");
    }
    out.append("</ul>\n<div class=\"scroll\"><table class=\"categories\"><thead><tr><th scope=\"col\" rowspan=\"2\">Category</th>"
        + "<th scope=\"col\" rowspan=\"2\">Tickets</th><th scope=\"col\" rowspan=\"2\">In scope</th>");
    systemHeaders(out, systems, 3);
    out.append("</tr><tr>");
    for (int i = 0; i < systems.size(); i++) {
      out.append("<th scope=\"col\" class=\"first\">Top-1</th><th scope=\"col\">Answered</th>"
          + "<th scope=\"col\">Precision</th>");
    }
    out.append("</tr></thead><tbody>\n");
    List<CategoryRow> reference = systems.get(0).categories().rows();
    for (int r = 0; r < reference.size(); r++) {
      CategoryRow first = reference.get(r);
      out.append("<tr><th scope=\"row\">").append(escape(first.category())).append("</th><td>")
          .append(Html.count(first.tickets())).append("</td><td>").append(Html.count(first.inScope())).append("</td>");
      for (SystemReport s : systems) {
        // Every system covers the same tickets (checked when the report is built), so rows line up.
        CategoryRow row = s.categories().rows().get(r);
        out.append("<td class=\"first\">").append(Html.percent(row.top1())).append("</td><td>")
            .append(Html.percent(row.coverage())).append("</td><td>")
            .append(row.answered() == 0 ? "none answered" : Html.percent(row.precision())).append("</td>");
      }
      out.append("</tr>\n");
    }
    return out.append("</tbody></table></div>\n").toString();
  }

  private static String basis(CategoryTable.Basis basis) {
    return switch (basis) {
      case RECOMMENDED -> "the guaranteed threshold";
      case GIVEN -> "a chosen threshold (no guarantee: none could be certified)";
      case MEASURED -> "where measured precision first reaches the target (no guarantee: none could be certified)";
    };
  }

  private static void systemHeaders(StringBuilder out, List<SystemReport> systems, int span) {
    for (int s = 0; s < systems.size(); s++) {
      out.append("<th scope=\"colgroup\" class=\"system first\"").append(span > 1 ? " colspan=\"" + span + "\"" : "")
          .append("><span class=\"swatch\" style=\"border-color:").append(SvgCharts.colour(s)).append("\"></span>")
          .append(escape(systems.get(s).name())).append("</th>");
    }
  }
}
