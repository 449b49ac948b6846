package org.precedent.engine.rerank;

import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.core.type.TypeReference;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * One domain of CLINC150 (Larson et al. 2019, "An Evaluation Dataset for Intent Classification and
 * Out-of-Scope Prediction", EMNLP-IJCNLP), read in place from the shared datasets folder given by the
 * system property {@code precedent.datasets}. Each query becomes a question and its intent, in words
 * ({@code pin_change} -> "pin change"), the answer.
 */
public record ClincDomain(List<String> answers, List<TrainingPair> train, List<TrainingPair> validation,
    List<TrainingPair> test) {

  public static ClincDomain load(String domain) throws IOException {
    String root = System.getProperty("precedent.datasets");
    assertTrue(root != null, "set -Dprecedent.datasets to the shared datasets folder");
    Path dir = Path.of(root, "clinc150");
    assertTrue(Files.isRegularFile(dir.resolve("data_full.json")), "CLINC150 not found under " + dir);
    ObjectMapper json = new ObjectMapper();
    Map<String, List<String>> domains = json.readValue(dir.resolve("domains.json").toFile(), new TypeReference<>() {});
    Map<String, List<List<String>>> data = json.readValue(dir.resolve("data_full.json").toFile(),
        new TypeReference<>() {});
    Set<String> intents = Set.copyOf(domains.get(domain));
    List<String> answers = domains.get(domain).stream().map(ClincDomain::words).toList();
    return new ClincDomain(answers, pairs(data.get("train"), intents), pairs(data.get("val"), intents),
        pairs(data.get("test"), intents));
  }

  /** The out-of-scope queries of a split ("oos_val", "oos_test"), which no intent answers. */
  public static List<String> outOfScope(String split) throws IOException {
    Path dir = Path.of(System.getProperty("precedent.datasets"), "clinc150");
    Map<String, List<List<String>>> data = new ObjectMapper().readValue(
        dir.resolve("data_full.json").toFile(), new TypeReference<>() {});
    return data.get(split).stream().map(row -> row.get(0)).toList();
  }

  public static String words(String intent) {
    return intent.replace('_', ' ');
  }

  private static List<TrainingPair> pairs(List<List<String>> rows, Set<String> intents) {
    List<TrainingPair> out = new ArrayList<>();
    for (List<String> row : rows) {
      if (intents.contains(row.get(1))) {
        out.add(new TrainingPair(row.get(0), words(row.get(1))));
      }
    }
    return out;
  }
}
