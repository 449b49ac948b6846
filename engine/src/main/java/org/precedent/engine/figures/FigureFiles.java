package org.precedent.engine.figures;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;
import org.precedent.knowledge.io.AtomicFiles;

/** Reading and writing the figure files: JSON, errors naming the file and line, atomic writes. */
final class FigureFiles {
  static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

  private FigureFiles() {}

  static JsonNode read(Path file) throws IOException {
    try {
      return JSON.readTree(Files.readString(file, StandardCharsets.UTF_8));
    } catch (JsonProcessingException e) {
      throw new IOException(file + ": not valid JSON (line " + e.getLocation().getLineNr() + "): "
          + e.getOriginalMessage(), e);
    }
  }

  /** The text fields of {@code measuredWith}, in the file's order. */
  static Map<String, String> measuredWith(JsonNode root) {
    Map<String, String> with = new LinkedHashMap<>();
    root.path("measuredWith").fields().forEachRemaining(e -> with.put(e.getKey(), e.getValue().asText()));
    return with;
  }

  static void write(Path file, JsonNode root) throws IOException {
    AtomicFiles.writeString(file, JSON.writeValueAsString(root) + "\n");
  }
}
