package org.precedent.engine.rerank;

import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonMappingException;
import com.fasterxml.jackson.databind.exc.UnrecognizedPropertyException;
import com.fasterxml.jackson.databind.exc.ValueInstantiationException;
import com.fasterxml.jackson.dataformat.javaprop.JavaPropsMapper;
import java.io.IOException;
import java.io.StringReader;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Properties;
import java.util.stream.Collectors;

/**
 * Records kept as {@code .properties} files (a reranker's configuration, a training checkpoint's
 * state), mapped field by field by Jackson's properties format: one {@code name=value} line per record
 * component, the layout these files have always had, so files written before Jackson did the mapping
 * still read.
 *
 * <p>Reading is strict, because a model version's files can be edited by hand: every component must
 * be present, no unknown key is accepted, and each value must parse and pass the record's own checks.
 * Any failure is a {@link ModelLoadException} naming the file and the field.
 */
public final class PropertiesRecords {
  private static final JavaPropsMapper MAPPER = JavaPropsMapper.builder()
      .enable(DeserializationFeature.FAIL_ON_MISSING_CREATOR_PROPERTIES)
      .enable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES)
      .build();

  private PropertiesRecords() {}

  /** The record's components as properties, each value in Java's own text form for its type. */
  public static Properties toProperties(Record value) {
    try {
      return MAPPER.writeValueAsProperties(value);
    } catch (IOException e) {
      throw new IllegalStateException("cannot map " + value.getClass().getSimpleName() + " to properties", e);
    }
  }

  /** Properties as the text {@link Properties#store} writes: a comment line, a date line, escaped keys. */
  public static String text(Properties properties, String comment) {
    StringWriter out = new StringWriter();
    try {
      properties.store(out, comment);
    } catch (IOException e) {
      throw new IllegalStateException(e);
    }
    return out.toString();
  }

  /** A record as properties text, ready to be written to a file. */
  public static String text(Record value, String comment) {
    return text(toProperties(value), comment);
  }

  /** The properties of a UTF-8 file; a missing file is a {@link ModelLoadException} naming it. */
  public static Properties load(Path file) throws IOException {
    if (!Files.isRegularFile(file)) {
      throw new ModelLoadException("reranker file " + file + " is missing");
    }
    Properties p = new Properties();
    p.load(new StringReader(Files.readString(file, StandardCharsets.UTF_8)));
    return p;
  }

  /** A record read from a file; see {@link #toRecord}. */
  public static <T extends Record> T read(Path file, Class<T> type) throws IOException {
    return toRecord(load(file), type, file);
  }

  /**
   * Properties read from {@code file} as a record of {@code type}.
   *
   * @throws ModelLoadException naming the file and the field when a component is missing, a key is
   *     unknown, a value does not parse, or the record refuses it
   */
  public static <T extends Record> T toRecord(Properties properties, Class<T> type, Path file) {
    try {
      return MAPPER.readPropertiesAs(properties, type);
    } catch (JsonMappingException e) {
      throw new ModelLoadException(file + ": " + problem(e), e);
    } catch (IOException e) {
      throw new ModelLoadException(file + ": unreadable (" + e.getMessage() + ")", e);
    }
  }

  /** What is wrong, led by the field it concerns, without Jackson's source location. */
  private static String problem(JsonMappingException e) {
    if (e instanceof UnrecognizedPropertyException unknown) {
      return "field '" + unknown.getPropertyName() + "' is not one of "
          + new java.util.TreeSet<>(unknown.getKnownPropertyIds().stream().map(String::valueOf).toList());
    }
    if (e instanceof ValueInstantiationException && e.getCause() != null) {
      // The record's own check, whose message names the field.
      return e.getCause().getMessage();
    }
    String field = e.getPath().stream()
        .map(JsonMappingException.Reference::getFieldName)
        .collect(Collectors.joining("."));
    return field.isEmpty() ? e.getOriginalMessage() : "field '" + field + "': " + e.getOriginalMessage();
  }

  /**
   * One number beside a record's components (as a model version's anti-LM weight sits beside its
   * configuration), removed from {@code properties} so the rest maps onto the record.
   */
  public static double takeDouble(Properties properties, String key, double absent, Path file) {
    Object value = properties.remove(key);
    if (value == null) {
      return absent;
    }
    try {
      return Double.parseDouble(value.toString().trim());
    } catch (NumberFormatException e) {
      throw new ModelLoadException(file + ": field '" + key + "': not a number: '" + value + "'", e);
    }
  }
}
