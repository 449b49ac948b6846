package org.precedent.engine.decide;

import java.io.IOException;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.precedent.knowledge.clean.Placeholders;
import org.precedent.knowledge.group.Slots;

/**
 * Which field of an incoming ticket fills which slot of an answer's template
 * ({@code knowledge.group.Slots}): a help desk whose tickets arrive with the customer's collection
 * day, say, maps slot {@code day} to that field, and an answer whose only slot is {@code day} is
 * then sent with the day filled in instead of handed to a person.
 *
 * <p>The file ({@code DIR/slot-fields.properties}) holds one mapping a line, {@code slot = field};
 * {@code #} starts a comment. A slot name is lower-case letters, as templates write them; a field
 * name is letters, digits, '_', '-' or '.', up to 100 characters.
 *
 * @param fieldOfSlot the ticket field named for each slot
 */
public record SlotFields(Map<String, String> fieldOfSlot) {
  /** No mapping: every answer with slots is handed off for a person to fill in. */
  public static final SlotFields NONE = new SlotFields(Map.of());
  /** The longest value filled into a slot: a day, an amount, a reference, not a paragraph. */
  public static final int MAX_VALUE = 200;

  public SlotFields {
    fieldOfSlot = Map.copyOf(fieldOfSlot);
  }

  /**
   * The template with every slot filled from {@code fields}, or empty when a slot has no field
   * named for it, its field is absent or blank, or its value cannot be sent as it stands (longer
   * than {@link #MAX_VALUE}, a line break or control character, a redaction placeholder, a slot
   * marker): then a person fills it in, as without a mapping.
   */
  public Optional<String> fill(String template, Map<String, String> fields) {
    List<String> slots = Slots.names(template);
    if (slots.isEmpty() || fields.isEmpty()) {
      return Optional.empty();
    }
    String out = template;
    for (String slot : slots) {
      String field = fieldOfSlot.get(slot);
      String value = field == null ? null : fields.get(field);
      if (!sendable(value)) {
        return Optional.empty();
      }
      out = out.replace(Slots.OPEN + slot + Slots.CLOSE, value.strip());
    }
    return Optional.of(out);
  }

  /** The slots {@code template} holds and the field named for each (null when none is). */
  public Map<String, String> fieldsFor(String template) {
    Map<String, String> named = new LinkedHashMap<>();
    for (String slot : Slots.names(template)) {
      named.put(slot, fieldOfSlot.get(slot));
    }
    return named;
  }

  private static boolean sendable(String value) {
    if (value == null || value.isBlank() || value.strip().length() > MAX_VALUE
        || !Placeholders.in(value).isEmpty() || value.contains(Slots.OPEN)
        || value.contains(Slots.CLOSE)) {
      return false;
    }
    for (int i = 0; i < value.length(); i++) {
      char c = value.charAt(i);
      if (Character.isISOControl(c) || Character.getType(c) == Character.FORMAT) {
        return false;
      }
    }
    return true;
  }

  /**
   * Reads {@code file}; a missing file means {@link #NONE}. A bad line is an IOException naming
   * the file and line, so that a typing mistake never fills a slot from the wrong field.
   */
  public static SlotFields read(Path file) throws IOException {
    String text;
    try {
      text = StandardCharsets.UTF_8.newDecoder()
          .decode(java.nio.ByteBuffer.wrap(Files.readAllBytes(file))).toString();
    } catch (NoSuchFileException e) {
      return NONE;
    } catch (CharacterCodingException e) {
      throw new IOException(file + ": not UTF-8 text");
    }
    Map<String, String> map = new LinkedHashMap<>();
    String[] lines = text.split("\n", -1);
    for (int i = 0; i < lines.length; i++) {
      String line = lines[i].strip();
      if (line.isEmpty() || line.startsWith("#")) {
        continue;
      }
      String where = file + ":" + (i + 1) + ": ";
      int eq = line.indexOf('=');
      if (eq < 0) {
        throw new IOException(where + "expected 'slot = field', got '" + line + "'");
      }
      String slot = line.substring(0, eq).strip();
      String field = line.substring(eq + 1).strip();
      if (!slot.matches("[a-z]{1,40}")) {
        throw new IOException(where + "slot '" + slot + "' is not a slot name (lower-case "
            + "letters, as templates write them)");
      }
      if (!field.matches("[A-Za-z0-9_.-]{1,100}")) {
        throw new IOException(where + "field '" + field + "' is not a field name (letters, "
            + "digits, '_', '-' or '.', up to 100 characters)");
      }
      if (map.putIfAbsent(slot, field) != null) {
        throw new IOException(where + "slot '" + slot + "' is mapped already, to '"
            + map.get(slot) + "'");
      }
    }
    return new SlotFields(map);
  }
}
