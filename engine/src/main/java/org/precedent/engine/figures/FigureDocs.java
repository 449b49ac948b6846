package org.precedent.engine.figures;

import java.math.RoundingMode;
import java.text.DecimalFormat;
import java.text.DecimalFormatSymbols;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Writes expected figures into a Markdown document at its markers, so that documented figures come
 * from the expected-figures file and never from hand edits.
 *
 * <p>A marker is {@code <!--fig NAME-->VALUE<!--/fig-->} on one line, optionally with a
 * {@link DecimalFormat} pattern after the name ({@code <!--fig fused.threshold_coverage 0.0%-->});
 * without one the figure's own format is used. HTML comments do not show in rendered Markdown, so a
 * reader sees the value alone. An undefined figure is written as {@value #UNDEFINED}.
 */
public final class FigureDocs {
  static final String UNDEFINED = "none";
  private static final Pattern MARKER =
      Pattern.compile("<!--fig ([a-z0-9_.]+)(?: ([^>]*?))?-->(.*?)<!--/fig-->");
  private static final String OPEN = "<!--fig ";

  private FigureDocs() {}

  /**
   * The document with every marker's value replaced by its expected figure.
   *
   * @param source names the document in errors
   * @throws IllegalArgumentException for a marker left open on its line or naming a figure the file
   *     lacks, with the line number
   */
  public static String regenerate(String markdown, ExpectedFigures figures, String source) {
    String[] lines = markdown.split("\n", -1);
    StringBuilder out = new StringBuilder(markdown.length());
    for (int i = 0; i < lines.length; i++) {
      out.append(line(lines[i], figures, source + ":" + (i + 1)));
      if (i < lines.length - 1) {
        out.append('\n');
      }
    }
    return out.toString();
  }

  /** How many markers the document holds. */
  public static int markers(String markdown) {
    Matcher m = MARKER.matcher(markdown);
    int n = 0;
    while (m.find()) {
      n++;
    }
    return n;
  }

  private static String line(String line, ExpectedFigures figures, String where) {
    Matcher m = MARKER.matcher(line);
    StringBuilder out = new StringBuilder();
    int end = 0;
    while (m.find()) {
      if (line.substring(end, m.start()).contains(OPEN)) {
        throw new IllegalArgumentException(where + ": a figure marker is not closed with <!--/fig-->");
      }
      String name = m.group(1);
      ExpectedFigures.Figure f = figures.figure(name).orElseThrow(() -> new IllegalArgumentException(
          where + ": no figure '" + name + "' in the expected figures"));
      String pattern = m.group(2) != null ? m.group(2) : f.format();
      out.append(line, end, m.start());
      out.append("<!--fig ").append(name).append(m.group(2) != null ? " " + m.group(2) : "").append("-->");
      out.append(format(f.expected(), pattern, where));
      out.append("<!--/fig-->");
      end = m.end();
    }
    if (line.substring(end).contains(OPEN)) {
      throw new IllegalArgumentException(where + ": a figure marker is not closed with <!--/fig-->");
    }
    out.append(line.substring(end));
    return out.toString();
  }

  static String format(Double value, String pattern, String where) {
    if (value == null) {
      return UNDEFINED;
    }
    DecimalFormat format;
    try {
      format = new DecimalFormat(pattern, DecimalFormatSymbols.getInstance(Locale.ROOT));
    } catch (IllegalArgumentException e) {
      throw new IllegalArgumentException(where + ": '" + pattern + "' is not a decimal format pattern", e);
    }
    format.setRoundingMode(RoundingMode.HALF_UP);
    return format.format(value);
  }
}
