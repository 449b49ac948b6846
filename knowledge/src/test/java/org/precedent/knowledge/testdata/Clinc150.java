package org.precedent.knowledge.testdata;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;

/**
 * The CLINC150 intent dataset, read in place from the shared datasets folder.
 *
 * <p>Source: Larson et al. 2019, "An Evaluation Dataset for Intent Classification and Out-of-Scope
 * Prediction" (EMNLP-IJCNLP), repository clinc/oos-eval, files data_full.json and domains.json;
 * licence CC BY 3.0. Each pair is treated as a resolved ticket: the query is the question and the
 * intent is its answer group.
 */
public final class Clinc150 {
  private static final ObjectMapper JSON = new ObjectMapper();

  private final JsonNode data;
  private final JsonNode domains;

  private Clinc150(JsonNode data, JsonNode domains) {
    this.data = data;
    this.domains = domains;
  }

  /** One query and its intent ("oos" for out-of-scope queries). */
  public record Example(String query, String intent) {}

  /** The folder of shared datasets: system property precedent.datasets, else ../shared/datasets. */
  public static Path datasets() {
    String configured = System.getProperty("precedent.datasets");
    return configured != null ? Path.of(configured) : Path.of("..", "shared", "datasets");
  }

  public static Clinc150 load() {
    Path dir = datasets().resolve("clinc150");
    try {
      return new Clinc150(JSON.readTree(Files.readAllBytes(dir.resolve("data_full.json"))),
          JSON.readTree(Files.readAllBytes(dir.resolve("domains.json"))));
    } catch (IOException e) {
      throw new UncheckedIOException("CLINC150 not found in " + dir.toAbsolutePath(), e);
    }
  }

  /** The 15 intents of a domain, such as "banking". */
  public Set<String> intents(String domain) {
    Set<String> intents = new TreeSet<>();
    domains.get(domain).forEach(n -> intents.add(n.asText()));
    if (intents.isEmpty()) {
      throw new IllegalArgumentException("no CLINC150 domain " + domain);
    }
    return intents;
  }

  /** A split ("train", "val", "test", "oos_train", ...), optionally restricted to some intents. */
  public List<Example> split(String name, Set<String> intents) {
    List<Example> out = new ArrayList<>();
    for (JsonNode pair : data.get(name)) {
      String intent = pair.get(1).asText();
      if (intents == null || intents.contains(intent)) {
        out.add(new Example(pair.get(0).asText(), intent));
      }
    }
    return out;
  }

  /** Writes examples as a CSV export with columns text,category, as a team would export them. */
  public static Path writeCsv(List<Example> examples, Path file) throws IOException {
    StringBuilder csv = new StringBuilder("text,category\n");
    for (Example e : examples) {
      csv.append('"').append(e.query().replace("\"", "\"\"")).append("\",").append(e.intent())
          .append('\n');
    }
    Files.writeString(file, csv);
    return file;
  }
}
