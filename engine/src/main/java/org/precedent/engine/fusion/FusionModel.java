package org.precedent.engine.fusion;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.precedent.engine.rerank.ModelLoadException;
import org.precedent.knowledge.io.AtomicFiles;

/**
 * The fitted fusion and calibration of a model version, one {@link SystemModel} per scoring system,
 * saved as {@code fusion.json} beside the reranker's weights.
 *
 * @param systems    the systems' fitted parts: BM25 always; the reranker and fused unless the
 *                   version holds no reranker; with a dense leg the dense system too; fused
 *                   without the reranker in models trained since it was added
 * @param validation what the fit measured on the fusion split, per system, for reports
 */
public record FusionModel(List<SystemModel> systems, Map<String, Map<String, Double>> validation) {
  static final String FILE = "fusion.json";
  private static final ObjectMapper JSON = new ObjectMapper();

  public FusionModel {
    systems = List.copyOf(systems);
    // Kept in the systems' order, for reports.
    validation = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(validation));
    // A model without the reranker has none of its systems; one with it has both of them.
    boolean reranker = systems.stream().anyMatch(m -> m.system().usesReranker());
    for (ScoringSystem s : ScoringSystem.ALWAYS) {
      if ((reranker || !s.usesReranker()) && systems.stream().noneMatch(m -> m.system() == s)) {
        throw new IllegalArgumentException("fusion model lacks the " + s + " system");
      }
    }
    boolean dense = systems.stream().anyMatch(m -> m.system() == ScoringSystem.DENSE);
    for (SystemModel m : systems) {
      if (!m.features().equals(m.system().features(dense))) {
        throw new IllegalArgumentException("the " + m.system() + " model was fitted on features "
            + m.features() + ", but a fusion model " + (dense ? "with" : "without")
            + " a dense leg needs " + m.system().features(dense));
      }
    }
  }

  /** @throws IllegalArgumentException when the model has no such system (see {@link #has}) */
  public SystemModel system(ScoringSystem s) {
    return systems.stream().filter(m -> m.system() == s).findFirst().orElseThrow(
        () -> new IllegalArgumentException("this model version has no " + s.label()
            + " system"));
  }

  /** Whether the model has the system: the dense ones only when trained with a dense leg. */
  public boolean has(ScoringSystem s) {
    return systems.stream().anyMatch(m -> m.system() == s);
  }

  /** Whether the model learnt from the dense leg: decisions must then embed the question. */
  public boolean dense() {
    return has(ScoringSystem.DENSE);
  }

  /** Whether the model learnt from the reranker's scores, so that decisions may need them. */
  public boolean reranker() {
    return has(ScoringSystem.RERANKER);
  }

  /** The systems it has, in {@link ScoringSystem} order. */
  public List<ScoringSystem> fitted() {
    return java.util.Arrays.stream(ScoringSystem.values()).filter(this::has).toList();
  }

  public void save(Path versionDir) throws IOException {
    AtomicFiles.write(versionDir.resolve(FILE),
        out -> out.write(JSON.writerWithDefaultPrettyPrinter().writeValueAsBytes(this)));
  }

  public static FusionModel load(Path versionDir) throws IOException {
    Path file = versionDir.resolve(FILE);
    if (!Files.exists(file)) {
      throw new ModelLoadException(file + ": missing; this model version was not finished "
          + "(train again)");
    }
    try {
      return JSON.readValue(file.toFile(), FusionModel.class);
    } catch (IOException | IllegalArgumentException e) {
      throw new ModelLoadException(file + ": unreadable fusion model: "
          + String.valueOf(e.getMessage()).split("\n")[0], e);
    }
  }
}
