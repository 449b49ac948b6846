package org.precedent.engine.decide;

import java.io.Closeable;
import java.io.IOException;
import java.io.Reader;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.Map;
import java.util.Properties;
import org.precedent.engine.measure.ThresholdDecimals;
import org.precedent.engine.rerank.RerankerModel;
import org.precedent.engine.rerank.Scorer;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.engine.safety.SafetyPolicy;
import org.precedent.knowledge.store.AtomicFiles;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;

/**
 * Everything in force in a data directory: the stored knowledge, the active model version (reranker
 * and fusion), the safety policy ({@code DIR/safety.rules}, else the built-in rules) and the
 * thresholds ({@code DIR/thresholds.properties}, else {@link #DEFAULT_THRESHOLD}).
 */
public final class ActiveModel implements Closeable {
  /** Until a manager sets one from an evaluation, reply only when very sure (common practice). */
  public static final double DEFAULT_THRESHOLD = 0.95;
  static final String THRESHOLDS = "thresholds.properties";
  static final String SAFETY = "safety.rules";

  private final Knowledge knowledge;
  private final String version;
  private final Scorer scorer;
  private final FusionModel fusion;
  private final SafetyPolicy safety;
  private final Thresholds thresholds;

  private ActiveModel(Knowledge knowledge, String version, Scorer scorer, FusionModel fusion,
      SafetyPolicy safety, Thresholds thresholds) {
    this.knowledge = knowledge;
    this.version = version;
    this.scorer = scorer;
    this.fusion = fusion;
    this.safety = safety;
    this.thresholds = thresholds;
  }

  /** Opens what is in force; a clear IOException says what is missing. */
  public static ActiveModel open(DataDir dir) throws IOException {
    Knowledge knowledge = Knowledge.open(dir).orElseThrow(() -> new IOException(
        "no tickets in " + dir.root() + " yet: run 'precedent ingest FILE' first"));
    try {
      ModelStore store = new ModelStore(dir.models());
      String version = store.activeVersion().orElseThrow(() -> new IOException(
          "no trained model in " + dir.root() + " yet: run 'precedent train' first"));
      RerankerModel model = store.load(version);
      FusionModel fusion = FusionModel.load(store.directory(version));
      Path rules = dir.root().resolve(SAFETY);
      SafetyPolicy safety = Files.exists(rules) ? SafetyPolicy.load(rules) : SafetyPolicy.defaults();
      return new ActiveModel(knowledge, version, new Scorer(model), fusion, safety,
          readThresholds(dir));
    } catch (IOException | RuntimeException e) {
      knowledge.close();
      throw e;
    }
  }

  public Advisor advisor() {
    return new Advisor(knowledge.retriever(), scorer, fusion, safety, thresholds);
  }

  public Knowledge knowledge() {
    return knowledge;
  }

  public String version() {
    return version;
  }

  public Scorer scorer() {
    return scorer;
  }

  public FusionModel fusion() {
    return fusion;
  }

  public SafetyPolicy safety() {
    return safety;
  }

  public Thresholds thresholds() {
    return thresholds;
  }

  static Thresholds readThresholds(DataDir dir) throws IOException {
    Path file = dir.root().resolve(THRESHOLDS);
    Properties p = new Properties();
    try (Reader in = Files.newBufferedReader(file)) {
      p.load(in);
    } catch (NoSuchFileException e) {
      return Thresholds.global(DEFAULT_THRESHOLD);
    }
    try {
      double global = Double.parseDouble(p.getProperty("global", "" + DEFAULT_THRESHOLD));
      Map<String, Double> perCategory = new HashMap<>();
      for (String key : p.stringPropertyNames()) {
        if (key.startsWith("category.")) {
          perCategory.put(key.substring("category.".length()),
              Double.parseDouble(p.getProperty(key)));
        }
      }
      return new Thresholds(global, perCategory);
    } catch (IllegalArgumentException e) {
      throw new IOException(file + ": " + e.getMessage(), e);
    }
  }

  /** Sets the thresholds in force for later runs (written atomically). */
  public static void writeThresholds(DataDir dir, Thresholds thresholds) throws IOException {
    StringBuilder s = new StringBuilder("# Confidence needed for an automatic reply.\n");
    // Every digit is kept: a threshold written rounded would be another rule than the one chosen.
    s.append("global=").append(ThresholdDecimals.of(thresholds.global(), 4)).append('\n');
    thresholds.perCategory().forEach((c, v) ->
        s.append("category.").append(c).append('=').append(ThresholdDecimals.of(v, 4))
            .append('\n'));
    AtomicFiles.writeString(dir.root().resolve(THRESHOLDS), s.toString());
  }

  @Override
  public void close() throws IOException {
    knowledge.close();
  }
}
