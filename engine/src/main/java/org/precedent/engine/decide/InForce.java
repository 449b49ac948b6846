package org.precedent.engine.decide;

import java.io.Closeable;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.precedent.engine.dense.AnswerClassifier;
import org.precedent.engine.dense.DenseLeg;
import org.precedent.engine.fusion.FusionModel;
import org.precedent.engine.rerank.ModelLoadException;
import org.precedent.engine.rerank.RerankerModel;
import org.precedent.engine.rerank.Scorer;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.engine.safety.SafetyPolicy;
import org.precedent.knowledge.embed.Encoders;
import org.precedent.knowledge.retrieve.Retriever;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;
import org.precedent.knowledge.store.Manifest;

/**
 * Everything in force in a data directory, opened: the stored knowledge and its open index, the
 * active model version (reranker, fusion, and the dense leg when it learnt from one), the safety policy ({@code DIR/safety.rules}, else the
 * built-in rules), the thresholds ({@code DIR/thresholds.properties}, else
 * {@link #DEFAULT_THRESHOLD}), and the {@link Pipeline} that decides with them. Closing it closes
 * the index.
 */
public final class InForce implements Closeable {
  /** Until a manager sets one from an evaluation, reply only when very sure (common practice). */
  public static final double DEFAULT_THRESHOLD = 0.95;

  private final Knowledge knowledge;
  private final Retriever retriever;
  private final String version;
  private final Scorer scorer;
  private final FusionModel fusion;
  private final DenseLeg dense;
  private final SafetyPolicy safety;
  private final Thresholds thresholds;
  private final SlotFields slotFields;

  private InForce(Knowledge knowledge, Retriever retriever, String version, Scorer scorer,
      FusionModel fusion, DenseLeg dense, SafetyPolicy safety, Thresholds thresholds,
      SlotFields slotFields) {
    this.knowledge = knowledge;
    this.retriever = retriever;
    this.version = version;
    this.scorer = scorer;
    this.fusion = fusion;
    this.dense = dense;
    this.safety = safety;
    this.thresholds = thresholds;
    this.slotFields = slotFields;
  }

  /** Opens what is in force; a clear IOException says what is missing. */
  public static InForce open(DataDir dir) throws IOException {
    return open(dir, null);
  }

  /**
   * Opens the knowledge, safety rules and thresholds in force with model {@code version} (null: the
   * active one), as the service would decide were that version activated: how {@code evaluate}
   * measures a candidate on the same held-out tickets as the version in force.
   */
  public static InForce open(DataDir dir, String modelVersion) throws IOException {
    Knowledge knowledge = Knowledge.open(dir).orElseThrow(() -> new IOException(
        "no tickets in " + dir.root() + " yet: run 'precedent ingest FILE' first"));
    Retriever retriever = Retriever.open(knowledge);
    DenseLeg dense = null;
    try {
      ModelStore store = new ModelStore(dir.models());
      String version = modelVersion != null ? modelVersion : store.activeVersion().orElseThrow(
          () -> new IOException("no trained model in " + dir.root()
              + " yet: run 'precedent train' first"));
      RerankerModel model = store.load(version);
      FusionModel fusion = FusionModel.load(store.directory(version));
      dense = openDenseLeg(knowledge, store.directory(version), fusion);
      Path rules = dir.safetyRules();
      SafetyPolicy safety = Files.exists(rules) ? SafetyPolicy.load(rules) : SafetyPolicy.defaults();
      return new InForce(knowledge, retriever, version, new Scorer(model), fusion, dense, safety,
          readThresholds(dir), SlotFields.read(dir.slotFields()));
    } catch (IOException | RuntimeException e) {
      if (dense != null) {
        dense.close();
      }
      retriever.close();
      throw e;
    }
  }

  /**
   * The dense leg when the model version learnt from it (else null): its classifier, and the
   * encoder that made the knowledge's vectors.
   */
  private static DenseLeg openDenseLeg(Knowledge knowledge, Path versionDir, FusionModel fusion)
      throws IOException {
    if (!fusion.dense()) {
      return null;
    }
    AnswerClassifier classifier = AnswerClassifier.loadIfPresent(versionDir);
    if (classifier == null) {
      throw new ModelLoadException(versionDir.resolve(AnswerClassifier.FILE) + ": missing, but "
          + "the version's fusion learnt from the dense leg (train again)");
    }
    Manifest.Vectors vectors = knowledge.manifest().vectors();
    if (vectors == null) {
      throw new IOException("model version " + versionDir.getFileName() + " learnt from question "
          + "vectors of encoder " + classifier.encoder() + ", but the knowledge in force holds "
          + "none: ingest again with -D" + Encoders.PROPERTY + "=" + classifier.encoder()
          + ", or train again for BM25 only");
    }
    return DenseLeg.open(vectors, classifier);
  }

  /** The pipeline that decides with what is in force. */
  public Pipeline pipeline() {
    return Assembly.pipeline(retriever, scorer, dense, fusion, safety, thresholds)
        .withSlotFields(slotFields);
  }

  public Knowledge knowledge() {
    return knowledge;
  }

  /** BM25 retrieval over the knowledge's index, open until this is closed. */
  public Retriever retriever() {
    return retriever;
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

  /** The thresholds in force in {@code dir}; an IOException names the file and line when bad. */
  public static Thresholds readThresholds(DataDir dir) throws IOException {
    return ThresholdsFile.read(dir.thresholds(), DEFAULT_THRESHOLD);
  }

  /** Sets the thresholds in force for later runs (written atomically). */
  public static void writeThresholds(DataDir dir, Thresholds thresholds) throws IOException {
    ThresholdsFile.write(dir.thresholds(), thresholds);
  }

  /** The dense leg in force, or null when the model version was trained without one. */
  public DenseLeg dense() {
    return dense;
  }

  @Override
  public void close() throws IOException {
    if (dense != null) {
      dense.close();
    }
    retriever.close();
  }
}
