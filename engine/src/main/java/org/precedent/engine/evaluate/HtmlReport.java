package org.precedent.engine.evaluate;

import static org.precedent.engine.evaluate.Html.escape;

import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import org.precedent.engine.measure.ThresholdRecommendation;

/**
 * Renders a report as one self-contained HTML page: inline style, inline SVG, no script and nothing
 * fetched from elsewhere, so it can be mailed or archived as a single file and opened offline.
 */
public final class HtmlReport {
  private static final DateTimeFormatter DATE =
      DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm 'UTC'", Locale.ROOT).withZone(ZoneOffset.UTC);

  private HtmlReport() {}

  /**
   * @param report   the report to show
   * @param previous an earlier report to compare with, or null for none
   */
  public static String render(EvaluationReport report, EvaluationReport previous) {
    Objects.requireNonNull(report, "report");
    List<SystemReport> systems = report.systems();
    StringBuilder out = new StringBuilder(64_000);
    out.append("<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\">\n")
        .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
        .append("<title>Evaluation report \u2013 ").append(escape(report.dataset())).append("</title>\n")
        .append("<style>").append(ReportStyle.CSS).append("</style>\n</head><body><main>\n");
    header(out, report);
    out.append("<section id=\"recommendation\"><h2>Recommended reply threshold</h2>\n");
    for (int s = 0; s < systems.size(); s++) {
      recommendation(out, systems.get(s), s, report.delta());
    }
    out.append("</section>\n<section id=\"measures\"><h2>Systems side by side</h2>\n")
        .append(ReportTables.measures(systems)).append("</section>\n")
        .append("<section id=\"risk-coverage\"><h2>Mistakes against tickets answered</h2>\n<p class=\"lead\">Each line "
            + "lowers the threshold from left to right: more tickets are answered automatically, usually with "
            + "more mistakes among them. Lower is better.</p>\n")
        .append(SvgCharts.riskCoverage(report)).append("</section>\n")
        .append("<section id=\"reliability\"><h2>Does confidence mean what it says?</h2>\n<p class=\"lead\">Bars show "
            + "the share of replies that were right in each confidence band; on the diagonal, a confidence of "
            + "0.8 is right 8 times in 10. Bars below the diagonal mean the system is over-confident.</p>\n"
            + "<div class=\"figures\">\n");
    for (int s = 0; s < systems.size(); s++) {
      SystemReport system = systems.get(s);
      out.append("<figure>").append(SvgCharts.reliability(system, s)).append("<figcaption><b>")
          .append(escape(system.name())).append("</b> \u00b7 calibration error ")
          .append(Html.decimal(system.measures().expectedCalibrationError(), 3)).append("</figcaption></figure>\n");
    }
    out.append("</div></section>\n<section id=\"thresholds\"><h2>What each threshold would do</h2>\n<p class=\"lead\">"
            + "Measured on the ").append(Html.count(report.tickets())).append(" held-out tickets; the interval is "
            + "the 95% Wilson interval of the precision. \u201cWrong per 1,000\u201d counts wrong automatic replies "
            + "per 1,000 incoming tickets.</p>\n")
        .append(ReportTables.thresholds(systems)).append("</section>\n")
        .append("<section id=\"categories\"><h2>By category</h2>\n<p class=\"lead\">A threshold that is safe overall "
            + "can still be unsafe for one category. Figures at each system\u2019s threshold:</p>\n")
        .append(ReportTables.categories(systems)).append("</section>\n");
    if (previous != null) {
      out.append(Changes.html(previous, report));
    }
    out.append("<footer><p class=\"footnote\">Precedent never replies automatically to questions about safety, "
        + "health, money or legal matters, whatever the confidence: those tickets always go to a person.</p>\n")
        .append("<p class=\"footnote\">Built ").append(escape(date(report.createdAt())))
        .append(". Precision guarantees assume that future tickets resemble the held-out ones.</p></footer>\n")
        .append("</main></body></html>\n");
    return out.toString();
  }

  static String date(Instant instant) {
    return DATE.format(instant);
  }

  private static void header(StringBuilder out, EvaluationReport report) {
    int outOfScope = report.tickets() - report.inScopeTickets();
    out.append("<header><p class=\"kicker\">Precedent \u00b7 evaluation report</p>\n<h1>")
        .append(escape(report.dataset())).append("</h1>\n<dl class=\"facts\">")
        .append(fact("Held-out tickets", Html.count(report.tickets())))
        .append(fact("In scope", Html.count(report.inScopeTickets())))
        .append(fact("Out of scope", Html.count(outOfScope)))
        .append(fact("Systems", Html.count(report.systems().size())))
        .append(fact("Target precision", Html.percent(report.targetPrecision())))
        .append(fact("Built", escape(date(report.createdAt()))))
        .append("</dl></header>\n");
  }

  private static String fact(String name, String value) {
    return "<div><dt>" + name + "</dt><dd>" + value + "</dd></div>";
  }

  /** The recommendation in plain words; when none can be given, says why in the measures' own words. */
  static void recommendation(StringBuilder out, SystemReport system, int index, double delta) {
    ThresholdRecommendation r = system.recommendation();
    out.append("<div class=\"advice ").append(r.repliesAutomatically() ? "ok" : "none")
        .append("\" style=\"border-left-color:").append(SvgCharts.colour(index)).append("\"><h3>")
        .append(escape(system.name())).append("</h3>\n<p class=\"headline\">");
    String target = Html.percent(r.targetPrecision());
    String confidence = Html.wholePercent(1.0 - delta);
    switch (r.status()) {
      case OK -> out.append("Reply automatically when confidence \u2265 ").append(Html.thresholdUp(r.threshold()))
          .append(": about ").append(Html.wholePercent(r.coverage())).append(" of tickets answered, precision ")
          .append(Html.percent(r.empiricalPrecision())).append(" (").append(confidence).append(" lower bound ")
          .append(Html.percent(r.precisionLowerBound())).append(") on ").append(Html.count(r.sampleSize()))
          .append(" held-out tickets.</p>\n<p class=\"detail\">With probability at least ").append(confidence)
          .append(", the true precision at this threshold is at least ").append(target)
          .append(". Everything below the threshold goes to a person.");
      case TOO_FEW -> out.append("Hand every ticket to a person: too few held-out tickets to guarantee ")
          .append(target).append(" precision.</p>\n<p class=\"detail\">").append(escape(r.explanation()));
      case NOT_CERTIFIED -> out.append("Hand every ticket to a person: no threshold could be guaranteed to reach ")
          .append(target).append(" precision.</p>\n<p class=\"detail\">").append(escape(r.explanation()));
    }
    out.append("</p></div>\n");
  }
}
