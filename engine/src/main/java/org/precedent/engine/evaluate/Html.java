package org.precedent.engine.evaluate;

import java.util.Locale;

/** Escaping and number formats shared by the HTML report's parts. */
final class Html {
  /** Shown for an undefined (NaN) value, so a reader never mistakes it for a measured 0. */
  static final String NOT_AVAILABLE = "n/a";

  private Html() {}

  /**
   * Makes text safe inside element content and inside quoted attribute values. Every string that
   * comes from data (dataset, system and category names) must pass through here: a category named
   * {@code <script>} has to show up as text, not run.
   */
  static String escape(String text) {
    if (text == null) {
      return "";
    }
    StringBuilder out = new StringBuilder(text.length() + 16);
    for (int i = 0; i < text.length(); i++) {
      char c = text.charAt(i);
      switch (c) {
        case '&' -> out.append("&amp;");
        case '<' -> out.append("&lt;");
        case '>' -> out.append("&gt;");
        case '"' -> out.append("&quot;");
        case '\'' -> out.append("&#39;");
        default -> out.append(c);
      }
    }
    return out.toString();
  }

  /** A share as a percentage with one decimal, e.g. 0.9642 -> "96.4%". */
  static String percent(double share) {
    return Double.isNaN(share) ? NOT_AVAILABLE : String.format(Locale.ROOT, "%.1f%%", 100.0 * share);
  }

  /** A share as a whole percentage, for "about 61% of tickets". */
  static String wholePercent(double share) {
    return Double.isNaN(share) ? NOT_AVAILABLE : String.format(Locale.ROOT, "%.0f%%", 100.0 * share);
  }

  static String decimal(double value, int digits) {
    return Double.isNaN(value) ? NOT_AVAILABLE : String.format(Locale.ROOT, "%." + digits + "f", value);
  }

  static String count(long n) {
    return String.format(Locale.ROOT, "%,d", n);
  }

  /**
   * A threshold rounded up to 4 decimals. Rounding down would show a rule that answers a few tickets
   * below the certified threshold, which the guarantee does not cover; rounding up only answers fewer.
   */
  static String thresholdUp(double threshold) {
    double up = Math.ceil(threshold * 10_000.0 - 1e-9) / 10_000.0;
    return String.format(Locale.ROOT, "%.4f", Math.min(1.0, up));
  }

  /** Coordinates in SVG, two decimals: finer than a pixel, short enough to keep the page small. */
  static String coordinate(double value) {
    return String.format(Locale.ROOT, "%.2f", value);
  }
}
