package org.precedent.engine.evaluate;

import static org.precedent.engine.evaluate.Html.coordinate;
import static org.precedent.engine.evaluate.Html.escape;

import java.util.List;
import org.precedent.engine.measure.ReliabilityBin;
import org.precedent.engine.measure.RiskCoveragePoint;

/**
 * Inline SVG charts. Curves are the only {@code <polyline>} elements, one per system; axes, grid and
 * bars use lines and rectangles.
 */
final class SvgCharts {
  /**
   * Okabe and Ito's palette for colour-blind readers (yellow left out: too faint on white). Each
   * system also gets its own dash pattern so the lines differ without colour, e.g. in print.
   */
  private static final String[] COLOURS = {"#0072B2", "#D55E00", "#009E73", "#CC79A7", "#E69F00", "#56B4E9", "#000000"};
  private static final String[] DASHES = {"", "9 4", "2 3", "12 4 2 4", "5 5", "1 6", "14 3 3 3 3 3"};
  private static final int NAME_CHARS = 38;

  // Risk-coverage chart geometry, in SVG user units.
  private static final double LEFT = 72;
  private static final double TOP = 20;
  private static final double PLOT_W = 620;
  private static final double PLOT_H = 340;
  private static final double WIDTH = 1040;
  private static final double HEIGHT = 430;

  private SvgCharts() {}

  static String colour(int system) {
    return COLOURS[system % COLOURS.length];
  }

  static String dash(int system) {
    return DASHES[system % DASHES.length];
  }

  static String riskCoverage(EvaluationReport report) {
    List<SystemReport> systems = report.systems();
    double targetRisk = 1.0 - report.targetPrecision();
    double maxRisk = targetRisk;
    for (SystemReport s : systems) {
      for (RiskCoveragePoint p : s.riskCoverage()) {
        maxRisk = Math.max(maxRisk, p.risk());
      }
    }
    double step = niceStep(maxRisk);
    double yMax = Math.min(1.0, Math.ceil(maxRisk / step - 1e-9) * step);
    yMax = yMax <= 0 ? step : yMax;
    StringBuilder svg = new StringBuilder();
    svg.append("<svg class=\"chart\" viewBox=\"0 0 ").append((int) WIDTH).append(' ').append((int) HEIGHT)
        .append("\" role=\"img\" aria-labelledby=\"rc-title\" xmlns=\"http://www.w3.org/2000/svg\">\n")
        .append("<title id=\"rc-title\">Risk against coverage for each system: lower lines make fewer "
            + "mistakes at the same share of tickets answered</title>\n");
    for (int i = 0; i <= 10; i++) {
      double x = x(i / 10.0);
      svg.append(line(x, TOP, x, TOP + PLOT_H, "grid"))
          .append(text(x, TOP + PLOT_H + 20, i * 10 + "%", "tick middle"));
    }
    int yTicks = (int) Math.round(yMax / step);
    for (int i = 0; i <= yTicks; i++) {
      double y = TOP + PLOT_H - PLOT_H * (i * step) / yMax;
      svg.append(line(LEFT, y, LEFT + PLOT_W, y, "grid"))
          .append(text(LEFT - 8, y + 4, Html.percent(i * step).replace(".0%", "%"), "tick end"));
    }
    svg.append(line(LEFT, TOP + PLOT_H, LEFT + PLOT_W, TOP + PLOT_H, "axis"))
        .append(line(LEFT, TOP, LEFT, TOP + PLOT_H, "axis"));
    if (targetRisk <= yMax) {
      double y = TOP + PLOT_H - PLOT_H * targetRisk / yMax;
      svg.append(line(LEFT, y, LEFT + PLOT_W, y, "target"));
    }
    svg.append(text(LEFT + PLOT_W / 2, HEIGHT - 14, "Coverage: share of tickets answered automatically", "label middle"))
        .append("<text class=\"label middle\" transform=\"translate(18 ").append(coordinate(TOP + PLOT_H / 2))
        .append(") rotate(-90)\">Risk: share of automatic replies that are wrong</text>\n");
    for (int s = 0; s < systems.size(); s++) {
      SystemReport system = systems.get(s);
      svg.append("<polyline class=\"curve\" fill=\"none\" stroke=\"").append(colour(s))
          .append("\" stroke-width=\"2.5\" stroke-linejoin=\"round\"");
      if (!dash(s).isEmpty()) {
        svg.append(" stroke-dasharray=\"").append(dash(s)).append('"');
      }
      svg.append(" points=\"");
      for (RiskCoveragePoint p : system.riskCoverage()) {
        svg.append(coordinate(x(p.coverage()))).append(',')
            .append(coordinate(TOP + PLOT_H - PLOT_H * Math.min(p.risk(), yMax) / yMax)).append(' ');
      }
      svg.append("\"><title>").append(escape(system.name())).append("</title></polyline>\n");
      if (system.recommendation().repliesAutomatically()) {
        double risk = 1.0 - system.recommendation().empiricalPrecision();
        svg.append("<circle cx=\"").append(coordinate(x(system.recommendation().coverage())))
            .append("\" cy=\"").append(coordinate(TOP + PLOT_H - PLOT_H * Math.min(risk, yMax) / yMax))
            .append("\" r=\"6\" fill=\"#fff\" stroke=\"").append(colour(s)).append("\" stroke-width=\"2.5\">")
            .append("<title>").append(escape(system.name())).append(": guaranteed threshold</title></circle>\n");
      }
    }
    legend(svg, systems, report.targetPrecision());
    return svg.append("</svg>\n").toString();
  }

  // The legend sits beside the plot, not in it, so that no label ever hides part of a curve.
  private static void legend(StringBuilder svg, List<SystemReport> systems, double targetPrecision) {
    double lx = LEFT + PLOT_W + 32;
    double y = TOP + 10;
    svg.append(text(lx, y, "Systems", "legend-head"));
    for (int s = 0; s < systems.size(); s++) {
      y += 26;
      svg.append("<line x1=\"").append(coordinate(lx)).append("\" y1=\"").append(coordinate(y - 4))
          .append("\" x2=\"").append(coordinate(lx + 44)).append("\" y2=\"").append(coordinate(y - 4))
          .append("\" stroke=\"").append(colour(s)).append("\" stroke-width=\"2.5\"");
      if (!dash(s).isEmpty()) {
        svg.append(" stroke-dasharray=\"").append(dash(s)).append('"');
      }
      svg.append("/>\n");
      String name = systems.get(s).name();
      // Long names are shortened to fit the legend; the full name stays in a tooltip.
      String shown = name.length() > NAME_CHARS ? name.substring(0, NAME_CHARS - 1) + "\u2026" : name;
      svg.append("<text class=\"legend\" x=\"").append(coordinate(lx + 54)).append("\" y=\"")
          .append(coordinate(y)).append("\">").append(escape(shown)).append("<title>").append(escape(name))
          .append("</title></text>\n");
    }
    y += 30;
    svg.append("<circle cx=\"").append(coordinate(lx + 22)).append("\" cy=\"").append(coordinate(y - 4))
        .append("\" r=\"6\" fill=\"#fff\" stroke=\"#4a5560\" stroke-width=\"2.5\"/>\n")
        .append(text(lx + 54, y, "guaranteed threshold", "legend"));
    y += 26;
    svg.append(line(lx, y - 4, lx + 44, y - 4, "target"))
        .append(text(lx + 54, y, "risk allowed by the " + Html.percent(targetPrecision) + " target", "legend"));
  }

  /** One small reliability diagram: bars show the share right per confidence bin, against the diagonal. */
  static String reliability(SystemReport system, int index) {
    double left = 50;
    double top = 12;
    double size = 240;
    StringBuilder svg = new StringBuilder();
    svg.append("<svg class=\"reliability\" viewBox=\"0 0 310 300\" role=\"img\" aria-label=\"Reliability diagram of ")
        .append(escape(system.name())).append("\" xmlns=\"http://www.w3.org/2000/svg\">\n");
    for (int i = 0; i <= 5; i++) {
      double v = i / 5.0;
      double gx = left + size * v;
      double gy = top + size - size * v;
      svg.append(line(gx, top, gx, top + size, "grid")).append(line(left, gy, left + size, gy, "grid"))
          .append(text(gx, top + size + 18, Html.decimal(v, 1), "tick middle"))
          .append(text(left - 7, gy + 4, Html.decimal(v, 1), "tick end"));
    }
    for (ReliabilityBin bin : system.reliability()) {
      if (bin.count() == 0) {
        continue;
      }
      double bx = left + size * bin.lower();
      double bh = size * bin.accuracy();
      svg.append("<rect x=\"").append(coordinate(bx + 1)).append("\" y=\"").append(coordinate(top + size - bh))
          .append("\" width=\"").append(coordinate(size * (bin.upper() - bin.lower()) - 2)).append("\" height=\"")
          .append(coordinate(bh)).append("\" fill=\"").append(colour(index)).append("\" fill-opacity=\"0.7\">")
          .append("<title>confidence ").append(Html.decimal(bin.lower(), 2)).append("\u2013")
          .append(Html.decimal(bin.upper(), 2)).append(": ").append(Html.count(bin.count()))
          .append(" tickets, mean confidence ").append(Html.decimal(bin.meanConfidence(), 2))
          .append(", ").append(Html.percent(bin.accuracy())).append(" right</title></rect>\n");
    }
    svg.append(line(left, top + size, left + size, top, "diagonal"))
        .append(line(left, top + size, left + size, top + size, "axis"))
        .append(line(left, top, left, top + size, "axis"))
        .append(text(left + size / 2, top + size + 40, "Confidence", "label middle"))
        .append("<text class=\"label middle\" transform=\"translate(14 ").append(coordinate(top + size / 2))
        .append(") rotate(-90)\">Share right</text>\n");
    return svg.append("</svg>\n").toString();
  }

  /** A tick step giving 4 to 10 ticks up to {@code max}. */
  static double niceStep(double max) {
    double[] steps = {0.01, 0.02, 0.025, 0.05, 0.1, 0.2, 0.25};
    for (double s : steps) {
      if (max / s <= 10) {
        return s;
      }
    }
    return 0.25;
  }

  private static double x(double coverage) {
    return LEFT + PLOT_W * coverage;
  }

  private static String line(double x1, double y1, double x2, double y2, String cls) {
    return "<line class=\"" + cls + "\" x1=\"" + coordinate(x1) + "\" y1=\"" + coordinate(y1) + "\" x2=\""
        + coordinate(x2) + "\" y2=\"" + coordinate(y2) + "\"/>\n";
  }

  private static String text(double x, double y, String content, String cls) {
    return "<text class=\"" + cls + "\" x=\"" + coordinate(x) + "\" y=\"" + coordinate(y) + "\">" + escape(content)
        + "</text>\n";
  }
}
