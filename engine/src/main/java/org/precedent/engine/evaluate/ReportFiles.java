package org.precedent.engine.evaluate;

import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.datatype.jsr310.JavaTimeModule;
import java.io.IOException;
import java.nio.file.Path;
import java.util.Objects;
import org.precedent.knowledge.io.AtomicFiles;

/**
 * Reads and writes report files. Writes go to a temporary file in the target's directory and are
 * then renamed over the target, so a reader (or a crash) never sees half a report.
 */
public final class ReportFiles {
  // Undefined measures are NaN; Jackson writes them as the strings "NaN" / "Infinity" and reads them
  // back, so a round trip keeps them rather than turning them into 0 or null.
  private static final ObjectMapper JSON = new ObjectMapper()
      .registerModule(new JavaTimeModule())
      .disable(SerializationFeature.WRITE_DATES_AS_TIMESTAMPS)
      .enable(SerializationFeature.INDENT_OUTPUT)
      .disable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES);

  private ReportFiles() {}

  public static void writeJson(EvaluationReport report, Path target) throws IOException {
    Objects.requireNonNull(report, "report");
    byte[] bytes = JSON.writeValueAsBytes(report);
    AtomicFiles.write(target, out -> out.write(bytes));
  }

  public static EvaluationReport readJson(Path source) throws IOException {
    return JSON.readValue(source.toFile(), EvaluationReport.class);
  }

  public static void writeHtml(String html, Path target) throws IOException {
    AtomicFiles.writeString(target, Objects.requireNonNull(html, "html"));
  }
}
