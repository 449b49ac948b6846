package org.precedent.engine.decide;

import java.io.IOException;
import java.io.StringReader;
import java.io.StringWriter;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Properties;
import java.util.TreeSet;
import org.precedent.engine.measure.ThresholdDecimals;
import org.precedent.knowledge.io.AtomicFiles;

/**
 * {@code DIR/thresholds.properties}: {@code global=0.9000} and one {@code category.NAME=0.9500}
 * line per category, in UTF-8. Keys are escaped by {@link Properties#store} itself, so whatever
 * name a category has reads back as it was written.
 */
final class ThresholdsFile {
  static final String CATEGORY = "category.";

  private ThresholdsFile() {}

  static void write(Path file, Thresholds thresholds) throws IOException {
    Properties p = new Properties();
    p.setProperty("global", number(thresholds.global()));
    thresholds.perCategory().forEach((c, v) -> p.setProperty(CATEGORY + c, number(v)));
    StringWriter out = new StringWriter();
    p.store(out, null);
    // store() writes one line per entry, in hash order, after a date comment: drop the date (the
    // file should change only when a threshold does) and keep a stable order.
    List<String> entries = new ArrayList<>();
    for (String line : out.toString().split("\\R")) {
      if (!line.isEmpty() && !line.startsWith("#")) {
        entries.add(line);
      }
    }
    entries.sort((a, b) -> a.startsWith("global=") ? -1 : b.startsWith("global=") ? 1
        : a.compareTo(b));
    StringBuilder s = new StringBuilder("# Confidence needed for an automatic reply.\n");
    entries.forEach(line -> s.append(line).append('\n'));
    AtomicFiles.writeString(file, s.toString());
  }

  /** The thresholds in {@code file}, or the default when there is none. */
  static Thresholds read(Path file, double defaultThreshold) throws IOException {
    String text;
    try {
      text = Files.readString(file, StandardCharsets.UTF_8);
    } catch (NoSuchFileException e) {
      return Thresholds.global(defaultThreshold);
    } catch (CharacterCodingException e) {
      throw new IOException(file + ": not UTF-8 text (" + e.getMessage() + ")", e);
    }
    Properties p = new Properties();
    try {
      p.load(new StringReader(text));
    } catch (IllegalArgumentException e) {
      throw new IOException(file + " line " + badLine(text) + ": " + e.getMessage()
          + " (a backslash must start an escape like \\uXXXX, or be doubled); correct or remove "
          + "that line", e);
    }
    double global = value(file, p, "global", defaultThreshold);
    Map<String, Double> perCategory = new HashMap<>();
    for (String key : new TreeSet<>(p.stringPropertyNames())) {
      if (key.startsWith(CATEGORY)) {
        perCategory.put(key.substring(CATEGORY.length()), value(file, p, key, Double.NaN));
      }
    }
    try {
      return new Thresholds(global, perCategory);
    } catch (IllegalArgumentException e) {
      throw new IOException(file + ": " + e.getMessage(), e);
    }
  }

  private static double value(Path file, Properties p, String key, double absent)
      throws IOException {
    String text = p.getProperty(key);
    if (text == null) {
      return absent;
    }
    try {
      return Double.parseDouble(text.strip());
    } catch (NumberFormatException e) {
      throw new IOException(file + ": " + key + ": '" + text + "' is not a number (like 0.95)", e);
    }
  }

  /** The first line after which the file no longer loads: where the malformed text ends. */
  private static int badLine(String text) {
    String[] lines = text.split("\\R", -1);
    StringBuilder prefix = new StringBuilder();
    for (int i = 0; i < lines.length; i++) {
      prefix.append(lines[i]).append('\n');
      try {
        new Properties().load(new StringReader(prefix.toString()));
      } catch (IllegalArgumentException | IOException e) {
        return i + 1;
      }
    }
    return lines.length;
  }

  private static String number(double v) {
    // Every digit is kept: a threshold written rounded would be another rule than the one chosen.
    return ThresholdDecimals.of(v, 4);
  }
}
