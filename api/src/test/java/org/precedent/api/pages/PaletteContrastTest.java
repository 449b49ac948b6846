package org.precedent.api.pages;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/** The pages' colours: the contrast the style sheet states, recomputed, and a palette of its own. */
class PaletteContrastTest {
  static final Path CSS = Path.of("src/main/resources/static/pages/precedent.css");
  static final Pattern VARIABLE = Pattern.compile("(--[a-z-]+):\\s*(#[0-9a-fA-F]{6});");
  static final Pattern STATED = Pattern.compile(
      "(--[a-z-]+|#[0-9a-fA-F]{6}) on (--[a-z-]+|#[0-9a-fA-F]{6}) ([0-9.]+):1");

  /**
   * Relative luminance of an sRGB colour, WCAG 2.1 (W3C Recommendation 2018, "relative
   * luminance"): channels linearised with the sRGB curve, weighted 0.2126, 0.7152, 0.0722. WCAG
   * writes the curve's knee as 0.03928, IEC 61966-2-1 as 0.04045; no 8-bit value lies between.
   */
  static double luminance(String hex) {
    double[] c = new double[3];
    for (int i = 0; i < 3; i++) {
      double v = Integer.parseInt(hex.substring(1 + 2 * i, 3 + 2 * i), 16) / 255.0;
      c[i] = v <= 0.04045 ? v / 12.92 : Math.pow((v + 0.055) / 1.055, 2.4);
    }
    return 0.2126 * c[0] + 0.7152 * c[1] + 0.0722 * c[2];
  }

  /** WCAG 2.1 contrast ratio (L1 + 0.05) / (L2 + 0.05), L1 the lighter. */
  static double contrast(String a, String b) {
    double la = luminance(a);
    double lb = luminance(b);
    return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
  }

  @Test
  void theFormulaGivesTheKnownExtremes() {
    // WCAG 2.1: black on white is 21:1, a colour on itself 1:1.
    assertEquals(21.0, contrast("#000000", "#ffffff"), 1e-9);
    assertEquals(1.0, contrast("#26285e", "#26285e"), 1e-9);
  }

  @Test
  void everyStatedTextContrastIsRightAndReachesLevelAA() throws IOException {
    String css = Files.readString(CSS);
    Map<String, String> colours = new HashMap<>();
    Matcher v = VARIABLE.matcher(css);
    while (v.find()) {
      colours.put(v.group(1), v.group(2));
    }
    Matcher m = STATED.matcher(css);
    int stated = 0;
    while (m.find()) {
      String fg = m.group(1).startsWith("#") ? m.group(1) : colours.get(m.group(1));
      String bg = m.group(2).startsWith("#") ? m.group(2) : colours.get(m.group(2));
      assertTrue(fg != null && bg != null, "unknown colour in " + m.group());
      double ratio = contrast(fg, bg);
      assertEquals(Double.parseDouble(m.group(3)), ratio, 0.006, m.group());
      // WCAG 2.1 success criterion 1.4.3: 4.5:1 for body text.
      assertTrue(ratio >= 4.5, m.group() + " is below 4.5:1");
      stated++;
    }
    assertTrue(stated >= 10, "the style sheet states " + stated + " contrast ratios");
  }

  @Test
  void theHeaderIsNotInTheGreenTealFamily() throws IOException {
    Matcher accent = Pattern.compile("--accent:\\s*(#[0-9a-fA-F]{6});").matcher(
        Files.readString(CSS));
    assertTrue(accent.find());
    String hex = accent.group(1);
    float[] hsb = java.awt.Color.RGBtoHSB(Integer.parseInt(hex.substring(1, 3), 16),
        Integer.parseInt(hex.substring(3, 5), 16), Integer.parseInt(hex.substring(5, 7), 16), null);
    double hue = hsb[0] * 360;
    // Green through teal to cyan: hues 90 to 200 degrees (a judgement of this project, no source).
    assertFalse(hue >= 90 && hue <= 200, hex + " has hue " + hue);
  }
}
