package org.precedent.knowledge.ingest;

import java.time.Instant;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.ticket.Category;
import org.precedent.knowledge.ticket.Ticket;

/**
 * Turns one source row into a cleaned ticket, or into the problems that keep it out.
 *
 * <p>Cleaning happens here, before anything is stored: greetings, signatures and quoted mail are
 * removed and personal data is redacted, so no later stage ever sees the raw text.
 */
final class RowValidator {
  /** Longest field accepted, in characters: about 30 pages of text (common practice, no source). */
  static final int MAX_FIELD_CHARS = 100_000;
  static final int MAX_ID_CHARS = 200;

  private final String file;
  private final String fileName;
  private final ColumnMapping mapping;
  private final TextCleaner cleaner;

  RowValidator(String file, String fileName, ColumnMapping mapping, TextCleaner cleaner) {
    this.file = file;
    this.fileName = fileName;
    this.mapping = mapping;
    this.cleaner = cleaner;
  }

  /** The ticket, or null with {@code problems} filled in. */
  Ticket validate(SourceRow row, List<RowProblem> problems) {
    int before = problems.size();
    Asked asked = asked(row, problems);
    if (asked == null) {
      return null;
    }
    Map<String, String> v = row.values();
    String id = asked.id();
    String question = asked.question();
    String label = mapping.label() == null ? null : emptyToNull(text(v, mapping.label()));
    String rawReply = mapping.reply() == null ? "" : text(v, mapping.reply());
    String reply;
    if (!rawReply.isEmpty()) {
      reply = cleaner.cleanReply(rawReply);
    } else if (label != null) {
      reply = inWords(label);
    } else {
      problems.add(problem(row, "reply", "empty" + (mapping.label() != null ? ", and no label" : "")));
      reply = "";
    }
    String category = asked.category();
    Instant created = null;
    if (mapping.created() != null && !text(v, mapping.created()).isEmpty()) {
      try {
        created = parseTime(text(v, mapping.created()));
      } catch (DateTimeParseException e) {
        problems.add(problem(row, "created", "'" + abbreviate(text(v, mapping.created()))
            + "' is not an ISO-8601 date or time (like 2026-03-12 or 2026-03-12T09:30:00Z)"));
      }
    }
    if (problems.size() > before) {
      return null;
    }
    return new Ticket(id, question, reply, label, category, created);
  }

  /**
   * A new ticket, read by the same rules as a resolved one (id, question, category and field
   * limits), with the first problem that keeps it from being decided.
   */
  NewTicket validateNew(SourceRow row) {
    List<RowProblem> problems = new ArrayList<>();
    Asked asked = asked(row, problems);
    if (asked == null || !problems.isEmpty()) {
      String id = asked != null && !asked.id().isEmpty() ? asked.id()
          : fileName + ":" + row.line();
      return new NewTicket(id, row.line(), null, asked == null ? null : asked.category(),
          problems.get(0));
    }
    return new NewTicket(asked.id(), row.line(), asked.question(), asked.category(), null);
  }

  /** What every ticket has, resolved or not. */
  private record Asked(String id, String question, String category) {}

  /**
   * The id, cleaned question and category of a row, with their problems added to {@code
   * problems}; null when the row cannot be read at all (unparsable, or a field over the limit).
   */
  private Asked asked(SourceRow row, List<RowProblem> problems) {
    if (row.error() != null) {
      problems.add(new RowProblem(file, row.line(), row.field(), row.error()));
      return null;
    }
    int before = problems.size();
    Map<String, String> v = row.values();
    for (Map.Entry<String, String> field : mapping.mapped().entrySet()) {
      String value = v.get(field.getValue());
      if (value != null && value.length() > MAX_FIELD_CHARS) {
        problems.add(problem(row, field.getKey(), String.format(Locale.ROOT,
            "%,d characters, over the limit of %,d", value.length(), MAX_FIELD_CHARS)));
      }
    }
    if (problems.size() > before) {
      return null;
    }
    String id = mapping.id() == null ? fileName + ":" + row.line() : text(v, mapping.id());
    if (id.isEmpty()) {
      problems.add(problem(row, "id", "empty"));
    } else if (id.length() > MAX_ID_CHARS) {
      problems.add(problem(row, "id", "longer than " + MAX_ID_CHARS + " characters"));
    }
    String rawQuestion = mapping.question() != null ? text(v, mapping.question())
        : join(text(v, mapping.subject()), text(v, mapping.body()));
    // Subject and body are cleaned apart: a greeting opens the body, not the subject line.
    String question = mapping.question() != null ? clean(text(v, mapping.question()))
        : join(clean(text(v, mapping.subject())), clean(text(v, mapping.body())));
    if (rawQuestion.isEmpty()) {
      problems.add(problem(row, mapping.question() != null ? "question" : "subject/body", "empty"));
    } else if (question.isBlank()) {
      problems.add(problem(row, "question",
          "nothing left once greetings, signatures and quoted mail are removed"));
    }
    String category = mapping.category() == null ? null
        : Category.normalise(text(v, mapping.category()));
    return new Asked(id, question, category);
  }

  private String clean(String raw) {
    return raw.isEmpty() ? "" : cleaner.cleanQuestion(raw);
  }

  /** A label in words: {@code pin_change} and {@code pin-change} become "pin change". */
  static String inWords(String label) {
    return label.replaceAll("[_\\-]+", " ").strip();
  }

  static Instant parseTime(String s) {
    try {
      return Instant.parse(s);
    } catch (DateTimeParseException e) {
      // fall through to the other ISO-8601 forms
    }
    try {
      return OffsetDateTime.parse(s).toInstant();
    } catch (DateTimeParseException e) {
      // fall through
    }
    try {
      return LocalDateTime.parse(s).toInstant(ZoneOffset.UTC);
    } catch (DateTimeParseException e) {
      // fall through
    }
    return LocalDate.parse(s).atStartOfDay().toInstant(ZoneOffset.UTC);
  }

  private RowProblem problem(SourceRow row, String field, String message) {
    return new RowProblem(file, row.line(), field, message);
  }

  private static String text(Map<String, String> values, String column) {
    if (column == null) {
      return "";
    }
    String value = values.get(column);
    return value == null ? "" : value.strip();
  }

  private static String join(String subject, String body) {
    List<String> parts = new ArrayList<>();
    if (!subject.isEmpty()) {
      parts.add(subject);
    }
    if (!body.isEmpty()) {
      parts.add(body);
    }
    return String.join("\n", parts);
  }

  private static String emptyToNull(String s) {
    return s.isEmpty() ? null : s;
  }

  private static String abbreviate(String s) {
    return s.length() <= 40 ? s : s.substring(0, 37) + "...";
  }
}
