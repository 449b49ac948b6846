package org.precedent.knowledge.testdata;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;

/**
 * The bundled demo help desk (invented data) and the generator's answer key for each ticket, which
 * ingest never reads: it lets tests judge answer grouping and retrieval against the truth.
 */
public final class DemoData {
  private DemoData() {}

  /** The demo-data folder of this checkout: system property precedent.root, else ../demo-data. */
  public static Path dir() {
    String root = System.getProperty("precedent.root");
    Path dir = root != null ? Path.of(root, "demo-data") : Path.of("..", "demo-data");
    if (!Files.isDirectory(dir)) {
      throw new IllegalStateException("demo data not found at " + dir.toAbsolutePath());
    }
    return dir;
  }

  /** Ticket id to the generator's answer key ("oneoff-..." for one-off tickets). */
  public static Map<String, String> answerKeys(Path csv) throws IOException {
    Map<String, String> keys = new LinkedHashMap<>();
    try (Reader in = Files.newBufferedReader(csv, StandardCharsets.UTF_8);
        CSVParser parser = CSVParser.builder().setReader(in)
            .setFormat(CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get())
            .get()) {
      for (CSVRecord r : parser) {
        keys.put(r.get("ticket_id"), r.get("template"));
      }
    }
    return keys;
  }

  public static boolean isOneOff(String answerKey) {
    return answerKey.startsWith("oneoff");
  }
}
