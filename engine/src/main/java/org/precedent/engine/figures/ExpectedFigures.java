package org.precedent.engine.figures;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Path;
import java.text.DecimalFormat;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * The figures a measured run is expected to reproduce, each with the tolerance it may move by: the
 * one source of the measured figures that DEVELOPERS.md shows (as regression files of reproducible
 * retrieval evaluations name each metric with its expected value and tolerance).
 *
 * <p>The file is JSON: {@code about} (words for a reader), {@code measuredWith} (where and how the
 * expected values were measured: text fields) and {@code figures}, a list of objects with
 * {@code name}, {@code label}, {@code expected} (a number, or null for a figure that the run leaves
 * undefined, such as the guaranteed threshold of a system that gets none), {@code tolerance} (the
 * largest accepted distance from {@code expected}, 0 for an exact match) and {@code format} (a
 * {@link DecimalFormat} pattern for the documents, such as {@code 0.000} or {@code 0.0%}).
 *
 * @param about        what the figures are and how to reproduce them
 * @param measuredWith where the expected values come from (date, machine, threads, model)
 * @param figures      the figures, in the order tables list them
 */
public record ExpectedFigures(String about, Map<String, String> measuredWith, List<Figure> figures) {
  private static final Pattern NAME = Pattern.compile("[a-z0-9_]+(\\.[a-z0-9_]+)*");

  /**
   * One expected figure.
   *
   * @param name      dotted lower-case name, such as {@code fused.top1}
   * @param label     what it is, in words
   * @param expected  the value, or null when the figure is expected to be undefined
   * @param tolerance largest accepted distance of a measured value from {@code expected}, at least 0
   * @param format    {@link DecimalFormat} pattern of the value in documents
   */
  public record Figure(String name, String label, Double expected, double tolerance, String format) {
    public Figure {
      if (name == null || !NAME.matcher(name).matches()) {
        throw new IllegalArgumentException("figure name '" + name
            + "' is not dotted lower-case words (letters, digits, _)");
      }
      if (expected != null && !Double.isFinite(expected)) {
        throw new IllegalArgumentException("figure " + name + ": expected value must be a finite number "
            + "or null, was " + expected);
      }
      if (!(tolerance >= 0) || Double.isInfinite(tolerance)) {
        throw new IllegalArgumentException("figure " + name + ": tolerance must be a finite number >= 0, was "
            + tolerance);
      }
      label = label == null ? name : label;
      format = format == null ? "0.000" : format;
      try {
        new DecimalFormat(format);
      } catch (IllegalArgumentException e) {
        throw new IllegalArgumentException("figure " + name + ": '" + format
            + "' is not a decimal format pattern (" + e.getMessage() + ")", e);
      }
    }

    /** The same figure expecting {@code value} (NaN or null: undefined). */
    public Figure expecting(Double value) {
      return new Figure(name, label, value == null || value.isNaN() ? null : value, tolerance, format);
    }
  }

  public ExpectedFigures {
    about = about == null ? "" : about;
    measuredWith = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(measuredWith));
    figures = List.copyOf(figures);
    Set<String> seen = new HashSet<>();
    for (Figure f : figures) {
      if (!seen.add(f.name())) {
        throw new IllegalArgumentException("figure " + f.name() + " is listed twice");
      }
    }
  }

  public Optional<Figure> figure(String name) {
    return figures.stream().filter(f -> f.name().equals(name)).findFirst();
  }

  /**
   * The same figures expecting the measured values, with {@code measuredWith} replaced; names,
   * labels, tolerances and formats are kept. A figure the run did not measure keeps its value.
   */
  public ExpectedFigures recorded(Map<String, Double> measured, Map<String, String> provenance) {
    List<Figure> out = new ArrayList<>();
    for (Figure f : figures) {
      out.add(measured.containsKey(f.name()) ? f.expecting(measured.get(f.name())) : f);
    }
    return new ExpectedFigures(about, provenance, out);
  }

  /** Reads the file; a malformed one is an {@link IOException} naming the file and the figure. */
  public static ExpectedFigures load(Path file) throws IOException {
    JsonNode root = FigureFiles.read(file);
    if (root == null || !root.isObject() || !root.path("figures").isArray()) {
      throw new IOException(file + ": expected an object with a 'figures' list");
    }
    Map<String, String> measuredWith = FigureFiles.measuredWith(root);
    List<Figure> figures = new ArrayList<>();
    int index = 0;
    for (JsonNode f : root.path("figures")) {
      String where = file + ": figures[" + index++ + "]";
      try {
        JsonNode expected = f.path("expected");
        if (!f.path("name").isTextual()) {
          throw new IllegalArgumentException("lacks a 'name'");
        }
        String name = "figure " + f.get("name").asText();
        if (!(expected.isNumber() || expected.isNull())) {
          throw new IllegalArgumentException(name + ": 'expected' must be a number or null");
        }
        if (!f.path("tolerance").isNumber()) {
          throw new IllegalArgumentException(name + ": 'tolerance' must be a number");
        }
        figures.add(new Figure(f.get("name").asText(), f.path("label").isTextual() ? f.get("label").asText() : null,
            expected.isNull() ? null : expected.asDouble(), f.get("tolerance").asDouble(),
            f.path("format").isTextual() ? f.get("format").asText() : null));
      } catch (IllegalArgumentException e) {
        throw new IOException(where + ": " + e.getMessage(), e);
      }
    }
    try {
      return new ExpectedFigures(root.path("about").asText(""), measuredWith, figures);
    } catch (IllegalArgumentException e) {
      throw new IOException(file + ": " + e.getMessage(), e);
    }
  }

  /** Writes the file atomically, in the layout {@link #load} reads. */
  public void save(Path file) throws IOException {
    ObjectNode root = FigureFiles.JSON.createObjectNode();
    root.put("about", about);
    ObjectNode with = root.putObject("measuredWith");
    measuredWith.forEach(with::put);
    ArrayNode list = root.putArray("figures");
    for (Figure f : figures) {
      ObjectNode o = list.addObject();
      o.put("name", f.name());
      o.put("label", f.label());
      if (f.expected() == null) {
        o.putNull("expected");
      } else {
        o.put("expected", f.expected());
      }
      o.put("tolerance", f.tolerance());
      o.put("format", f.format());
    }
    FigureFiles.write(file, root);
  }
}
