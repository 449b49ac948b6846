package org.precedent.knowledge.datasets;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.ticket.Ticket;

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

  private final Path folder;
  private final JsonNode data;
  private final JsonNode domains;

  private Clinc150(Path folder, JsonNode data, JsonNode domains) {
    this.folder = folder;
    this.data = data;
    this.domains = domains;
  }

  /** One query and its intent ("oos" for out-of-scope queries). */
  public record Example(String query, String intent) {}

  /**
   * The folder of shared datasets: system property {@code precedent.datasets}, else {@code
   * ../shared/datasets} beside the checkout ({@code precedent.home}, which the launcher sets), else
   * beside the working directory.
   */
  public static Path sharedDatasets() {
    String configured = System.getProperty("precedent.datasets");
    if (configured != null) {
      return Path.of(configured);
    }
    return Path.of(System.getProperty("precedent.home", "."), "..", "shared", "datasets");
  }

  /** CLINC150 from the shared datasets folder ({@link #sharedDatasets()}). */
  public static Clinc150 load() throws IOException {
    return load(sharedDatasets());
  }

  /** CLINC150 from {@code datasets/clinc150}; an IOException names the folder and the file. */
  public static Clinc150 load(Path datasets) throws IOException {
    Path dir = datasets.resolve("clinc150");
    return new Clinc150(dir, read(dir.resolve("data_full.json")), read(dir.resolve("domains.json")));
  }

  private static JsonNode read(Path file) throws IOException {
    if (!Files.isRegularFile(file)) {
      throw new IOException("CLINC150 file not found: " + file.toAbsolutePath().normalize());
    }
    JsonNode node = JSON.readTree(Files.readAllBytes(file));
    if (node == null || !node.isObject()) {
      throw new IOException(file + ": not the CLINC150 JSON object");
    }
    return node;
  }

  /** The domain names (banking, travel, ...). */
  public Set<String> domains() {
    Set<String> names = new TreeSet<>();
    domains.fieldNames().forEachRemaining(names::add);
    return names;
  }

  /** The 15 intents of a domain, such as "banking". */
  public Set<String> intents(String domain) {
    JsonNode list = domains.get(domain);
    if (list == null || list.isEmpty()) {
      throw new IllegalArgumentException("no CLINC150 domain '" + domain + "' in " + folder
          + " (domains: " + String.join(", ", domains()) + ")");
    }
    Set<String> intents = new TreeSet<>();
    list.forEach(n -> intents.add(n.asText()));
    return intents;
  }

  /** The 150 in-scope intents of all domains. */
  public Set<String> allIntents() {
    Set<String> intents = new TreeSet<>();
    domains().forEach(d -> intents.addAll(intents(d)));
    return intents;
  }

  /**
   * A split ("train", "val", "test", "oos_val", ...), restricted to some intents unless {@code
   * intents} is null.
   */
  public List<Example> split(String name, Set<String> intents) {
    JsonNode rows = data.get(name);
    if (rows == null) {
      throw new IllegalArgumentException("no CLINC150 split '" + name + "' in " + folder);
    }
    List<Example> out = new ArrayList<>();
    for (JsonNode pair : rows) {
      String intent = pair.get(1).asText();
      if (intents == null || intents.contains(intent)) {
        out.add(new Example(pair.get(0).asText(), intent));
      }
    }
    return out;
  }

  /**
   * Examples as labelled tickets, as ingest makes them from a question and a label column: the
   * cleaned query, the intent as label and, in words, as reply; ids are {@code prefix-N}.
   */
  public static List<Ticket> tickets(List<Example> examples, String prefix, TextCleaner cleaner) {
    List<Ticket> tickets = new ArrayList<>(examples.size());
    for (int i = 0; i < examples.size(); i++) {
      Example e = examples.get(i);
      tickets.add(new Ticket(prefix + "-" + i, cleaner.cleanQuestion(e.query()), inWords(e.intent()),
          e.intent(), null, null));
    }
    return tickets;
  }

  /** An intent in words, as ingest writes a label: {@code pin_change} becomes "pin change". */
  public static String inWords(String intent) {
    return intent.replace('_', ' ');
  }
}
