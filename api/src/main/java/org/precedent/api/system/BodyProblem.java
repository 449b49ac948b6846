package org.precedent.api.system;

import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParseException;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonStreamContext;
import com.fasterxml.jackson.databind.JsonMappingException;
import com.fasterxml.jackson.databind.exc.MismatchedInputException;
import com.fasterxml.jackson.databind.exc.UnrecognizedPropertyException;
import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.ArrayDeque;
import java.util.Arrays;
import java.util.Collection;
import java.util.Deque;
import java.util.Map;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Collectors;

/**
 * What is wrong with a JSON request body, said in the client's terms: the field (a path such as
 * {@code perCategory.bins}) and what it must be, or where the text stops being the one JSON object
 * expected. The parser's own messages name the service's classes and its settings; none of that
 * reaches the client.
 *
 * @param field   the field at fault, or null when the fault is in the body as a whole
 * @param message what is wrong (with the field, when there is one)
 */
record BodyProblem(String field, String message) {
  private static final Pattern DUPLICATE = Pattern.compile("^Duplicate field '(.*)'");

  /** The problem behind a body that could not be read, or null if it was not the JSON. */
  static BodyProblem of(Throwable failure) {
    // A syntax error inside a value comes wrapped in a mapping error; the syntax error says more.
    JsonProcessingException found = null;
    for (Throwable t = failure; t != null; t = t.getCause()) {
      if (t instanceof JsonParseException p) {
        return of(p);
      }
      if (found == null && t instanceof JsonProcessingException j) {
        found = j;
      }
    }
    return found == null ? null : of(found);
  }

  private static BodyProblem of(JsonProcessingException e) {
    if (e instanceof UnrecognizedPropertyException u) {
      Collection<Object> known = u.getKnownPropertyIds();
      String fields = known == null ? "" : known.stream().map(String::valueOf)
          .collect(Collectors.toCollection(TreeSet::new)).stream()
          .collect(Collectors.joining(", "));
      return new BodyProblem(path(u), "is not a field of this request"
          + (fields.isEmpty() ? "" : "; its fields are " + fields));
    }
    if (e instanceof MismatchedInputException m) {
      String field = path(m);
      if (m.getOriginalMessage().startsWith("Trailing token")) {
        return new BodyProblem(null, "the request body goes on after its JSON object"
            + at(m.getLocation()) + "; send one JSON object");
      }
      if (field.isEmpty()) {
        return new BodyProblem(null, "the request body must be a JSON object");
      }
      return new BodyProblem(field, expected(m.getTargetType()));
    }
    if (e instanceof JsonMappingException m && !path(m).isEmpty()) {
      return new BodyProblem(path(m), "cannot be read");
    }
    if (e instanceof JsonParseException p) {
      Matcher duplicate = DUPLICATE.matcher(p.getOriginalMessage());
      if (duplicate.find()) {
        JsonParser parser = p.getProcessor();
        String field = parser == null ? "" : path(parser.getParsingContext());
        return new BodyProblem(field.isEmpty() ? duplicate.group(1) : field,
            "is given twice; send each field once");
      }
      return new BodyProblem(null, "the request body is not valid JSON" + at(p.getLocation())
          + syntax(p.getOriginalMessage()));
    }
    return new BodyProblem(null, "the request body is not the JSON expected");
  }

  /** The field's path, as the client wrote it: names joined by dots, list positions in []. */
  private static String path(JsonMappingException e) {
    StringBuilder path = new StringBuilder();
    for (JsonMappingException.Reference r : e.getPath()) {
      if (r.getFieldName() != null) {
        path.append(path.length() == 0 ? "" : ".").append(r.getFieldName());
      } else if (r.getIndex() >= 0) {
        path.append('[').append(r.getIndex()).append(']');
      }
    }
    return path.toString();
  }

  private static String path(JsonStreamContext context) {
    Deque<String> segments = new ArrayDeque<>();
    for (JsonStreamContext c = context; c != null && !c.inRoot(); c = c.getParent()) {
      if (c.inObject() && c.getCurrentName() != null) {
        segments.push(c.getCurrentName());
      } else if (c.inArray()) {
        segments.push("[" + Math.max(0, c.getCurrentIndex()) + "]");
      }
    }
    StringBuilder path = new StringBuilder();
    for (String s : segments) {
      path.append(path.length() == 0 || s.startsWith("[") ? "" : ".").append(s);
    }
    return path.toString();
  }

  private static String at(JsonLocation location) {
    return location == null || location.getLineNr() < 1 ? ""
        : " at line " + location.getLineNr() + ", column " + location.getColumnNr();
  }

  /**
   * The parser's account of the syntax error, without the parts that describe the parser rather
   * than the text (its source description, its settings).
   */
  private static String syntax(String message) {
    String first = message == null ? "" : message.split("\n")[0];
    int source = first.indexOf(" (start marker at");
    if (source < 0) {
      source = first.indexOf(" at [Source");
    }
    if (source >= 0) {
      first = first.substring(0, source);
    }
    boolean internal = first.contains("`") || first.contains("Feature") || first.contains("java.")
        || first.contains("Source:");
    return first.isBlank() || internal ? "" : ": " + first;
  }

  /** What a value of the type must look like, in JSON's terms. */
  private static String expected(Class<?> type) {
    if (type == null) {
      return "has the wrong kind of value";
    }
    if (CharSequence.class.isAssignableFrom(type)) {
      return "must be text (a JSON string)";
    }
    if (type == Integer.class || type == int.class || type == Long.class || type == long.class
        || type == Short.class || type == short.class || type == BigInteger.class) {
      return "must be a whole number";
    }
    if (Number.class.isAssignableFrom(type) || type == double.class || type == float.class
        || type == BigDecimal.class) {
      return "must be a number";
    }
    if (type == Boolean.class || type == boolean.class) {
      return "must be true or false";
    }
    if (type.isEnum()) {
      return "must be one of " + Arrays.stream(type.getEnumConstants()).map(String::valueOf)
          .collect(Collectors.joining(", "));
    }
    if (Collection.class.isAssignableFrom(type) || type.isArray()) {
      return "must be a JSON list";
    }
    return Map.class.isAssignableFrom(type) || type.isRecord() ? "must be a JSON object"
        : "has the wrong kind of value";
  }
}
