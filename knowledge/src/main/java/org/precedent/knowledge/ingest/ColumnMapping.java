package org.precedent.knowledge.ingest;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Properties;
import java.util.Set;

/**
 * Which column of a ticket export holds which part of a ticket.
 *
 * <p>The question is either one column ({@code question}) or a subject and a body joined. The reply
 * may be left out when a label column is mapped: the reply then becomes the label in words
 * ({@code pin_change} becomes "pin change"). Resolved tickets ({@link #of}, {@link #fromFile}) need
 * one of the two; new tickets ({@link #forNewTickets}) have neither, and are read by the same rules
 * otherwise.
 *
 * @param id       column of the ticket id; when null, the id is the file name and record number
 * @param question column of the whole question, or null when subject and body are used
 * @param subject  column of the subject line, or null
 * @param body     column of the message body, or null
 * @param reply    column of the agent's reply, or null when {@code label} is mapped
 * @param label    column of an answer-group label, or null to find groups from the replies
 * @param category column of a category, or null
 * @param created  column of the creation time (ISO-8601), or null
 */
public record ColumnMapping(
    String id, String question, String subject, String body, String reply, String label,
    String category, String created) {

  /** The keys a mapping file may use, in the order they are reported. */
  public static final List<String> KEYS =
      List.of("id", "question", "subject", "body", "reply", "label", "category", "created");

  public ColumnMapping {
    id = blankToNull(id);
    question = blankToNull(question);
    subject = blankToNull(subject);
    body = blankToNull(body);
    reply = blankToNull(reply);
    label = blankToNull(label);
    category = blankToNull(category);
    created = blankToNull(created);
    if (question == null && subject == null && body == null) {
      throw new IllegalArgumentException(
          "the mapping names no question column: map 'question', or 'subject' and/or 'body'");
    }
    if (question != null && (subject != null || body != null)) {
      throw new IllegalArgumentException(
          "the mapping names both 'question' and 'subject'/'body': use one or the other");
    }
  }

  /** The keys a mapping of new tickets uses: they have no reply, label or resolution time yet. */
  public static final List<String> NEW_TICKET_KEYS = List.of("id", "question", "subject", "body",
      "category");

  /** A mapping read from a properties file ({@code key=column} lines), with command-line overrides. */
  public static ColumnMapping fromFile(Path file, Map<String, String> overrides) throws IOException {
    return of(read(file, overrides));
  }

  /**
   * A mapping of new tickets read from a mapping file, with command-line overrides: the file may
   * be the one their resolved tickets were ingested with, whose reply, label and created keys are
   * not used.
   */
  public static ColumnMapping newTicketsFromFile(Path file, Map<String, String> overrides)
      throws IOException {
    return forNewTickets(read(file, overrides));
  }

  private static Map<String, String> read(Path file, Map<String, String> overrides)
      throws IOException {
    Properties properties = new Properties();
    try (Reader reader = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
      properties.load(reader);
    } catch (NoSuchFileException e) {
      throw new NoSuchFileException(file.toString(), null, "mapping file not found");
    }
    Map<String, String> values = new LinkedHashMap<>();
    for (String key : properties.stringPropertyNames()) {
      if (!KEYS.contains(key)) {
        throw new IllegalArgumentException(
            file + ": unknown mapping key '" + key + "' (known keys: " + String.join(", ", KEYS) + ")");
      }
      values.put(key, properties.getProperty(key).strip());
    }
    overrides.forEach((k, v) -> {
      if (v != null) {
        values.put(k, v);
      }
    });
    return values;
  }

  /** A mapping of resolved tickets from key to column name; missing keys are unmapped. */
  public static ColumnMapping of(Map<String, String> values) {
    ColumnMapping mapping = new ColumnMapping(values.get("id"), values.get("question"),
        values.get("subject"), values.get("body"), values.get("reply"), values.get("label"),
        values.get("category"), values.get("created"));
    mapping.requireAnswer();
    return mapping;
  }

  /** A mapping of new tickets: only {@link #NEW_TICKET_KEYS} are used, the others ignored. */
  public static ColumnMapping forNewTickets(Map<String, String> values) {
    return new ColumnMapping(values.get("id"), values.get("question"), values.get("subject"),
        values.get("body"), null, null, values.get("category"), null);
  }

  /** Refuses a mapping of resolved tickets that names no reply and no label. */
  void requireAnswer() {
    if (reply == null && label == null) {
      throw new IllegalArgumentException(
          "the mapping names no reply column: map 'reply', or 'label' to use the label as the reply");
    }
  }

  /** Mapping key to column name, for every mapped key. */
  public Map<String, String> mapped() {
    Map<String, String> out = new LinkedHashMap<>();
    List<String> columns = new ArrayList<>();
    columns.add(id);
    columns.add(question);
    columns.add(subject);
    columns.add(body);
    columns.add(reply);
    columns.add(label);
    columns.add(category);
    columns.add(created);
    for (int i = 0; i < KEYS.size(); i++) {
      if (columns.get(i) != null) {
        out.put(KEYS.get(i), columns.get(i));
      }
    }
    return out;
  }

  /** The mapped columns that a header lacks, as "key (column)" descriptions. */
  List<String> missingFrom(Set<String> header) {
    List<String> missing = new ArrayList<>();
    mapped().forEach((key, column) -> {
      if (!header.contains(column)) {
        missing.add("'" + column + "' (mapped as " + key + ")");
      }
    });
    return missing;
  }

  private static String blankToNull(String s) {
    return s == null || s.isBlank() ? null : s.strip();
  }
}
