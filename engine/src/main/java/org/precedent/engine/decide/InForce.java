package org.precedent.engine.decide;

import java.io.Closeable;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.CompletableFuture;
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
  private final DeferredScorer scorer;
  private final FusionModel fusion;
  private final DenseLeg dense;
  private final SafetyPolicy safety;
  private final Thresholds thresholds;
  private final SlotFields slotFields;

  private final OpenTimes openTimes;

  /**
   * How long opening took, part by part, in milliseconds: where a one-question command's wait
   * goes.
   *
   * @param knowledge the stored generation (groups, manifest)
   * @param index     the Lucene index and the per-ticket tables held in memory
   * @param model     the model version's files checked against its manifest, and fusion read
   * @param dense     the dense leg: the sentence encoder's session and the answer classifier,
   *                  made on a thread of its own beside the index (so not added to the others)
   */
  public record OpenTimes(long knowledge, long index, long model, long dense) {}

  private InForce(Knowledge knowledge, Retriever retriever, String version, DeferredScorer scorer,
      FusionModel fusion, DenseLeg dense, SafetyPolicy safety, Thresholds thresholds,
      SlotFields slotFields, OpenTimes openTimes) {
    this.openTimes = openTimes;
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
    return open(dir, modelVersion, false);
  }

  /**
   * Opens what is in force but loads the reranker's network only when a decision first needs it
   * (checking its files against the manifest again then): for a command that asks one question,
   * which the faster legs often settle alone. A network that cannot be read then fails that
   * decision, not the opening.
   */
  public static InForce openRerankerOnFirstUse(DataDir dir) throws IOException {
    return openRerankerOnFirstUse(dir, () -> { });
  }

  /**
   * As {@link #openRerankerOnFirstUse(DataDir)}, running {@code beforeLoading} just before the
   * network loads: where a command says that the numeric library is loading, and only then.
   */
  public static InForce openRerankerOnFirstUse(DataDir dir, Runnable beforeLoading)
      throws IOException {
    return open(dir, null, beforeLoading);
  }

  private static InForce open(DataDir dir, String modelVersion, boolean deferReranker)
      throws IOException {
    return open(dir, modelVersion, deferReranker ? () -> { } : null);
  }

  /** @param beforeLoading null to load the reranker now, else what to run before loading it */
  private static InForce open(DataDir dir, String modelVersion, Runnable beforeLoading)
      throws IOException {
    boolean deferReranker = beforeLoading != null;
    long t0 = System.nanoTime();
    Knowledge knowledge = Knowledge.open(dir).orElseThrow(() -> new IOException(
        "no tickets in " + dir.root() + " yet: run 'precedent ingest FILE' first"));
    long t1 = System.nanoTime();
    ModelStore store = new ModelStore(dir.models());
    String version = modelVersion != null ? modelVersion : store.activeVersion().orElseThrow(
        () -> new IOException("no trained model in " + dir.root()
            + " yet: run 'precedent train' first"));
    // Every file of the version is checked before any is read: by loading the network, which
    // checks them all first, or on their own when the network waits for its first use (which
    // checks them again).
    // A version trained without the reranker has no scorer: it decides with the faster legs.
    DeferredScorer scorer;
    boolean hasReranker = store.hasReranker(version);
    if (deferReranker || !hasReranker) {
      store.verify(version);
      scorer = !hasReranker ? null : new DeferredScorer(() -> {
        beforeLoading.run();
        return new Scorer(store.load(version));
      });
    } else {
      long l0 = System.nanoTime();
      Scorer loaded = new Scorer(store.load(version));
      scorer = new DeferredScorer(loaded, System.nanoTime() - l0);
    }
    FusionModel fusion = FusionModel.load(store.directory(version));
    if (fusion.reranker() && scorer == null) {
      throw new ModelLoadException(store.directory(version).resolve("fusion.json") + ": learnt "
          + "from the reranker, but model version " + version + " holds none (train again)");
    }
    long t2 = System.nanoTime();
    // The encoder's session (native code, most of an opening's time) is made beside the index.
    long[] denseNanos = new long[1];
    CompletableFuture<DenseLeg> opening = new CompletableFuture<>();
    Thread denseThread = new Thread(() -> {
      long d0 = System.nanoTime();
      try {
        opening.complete(openDenseLeg(knowledge, store.directory(version), fusion));
      } catch (Throwable e) {
        opening.completeExceptionally(e);
      }
      denseNanos[0] = System.nanoTime() - d0;
    }, "precedent-open-dense-leg");
    denseThread.setDaemon(true);
    denseThread.start();
    Retriever retriever = null;
    DenseLeg dense = null;
    try {
      retriever = Retriever.open(knowledge);
      long t3 = System.nanoTime();
      dense = joined(opening);
      denseThread.join();
      Path rules = dir.safetyRules();
      SafetyPolicy safety = Files.exists(rules) ? SafetyPolicy.load(rules) : SafetyPolicy.defaults();
      return new InForce(knowledge, retriever, version, scorer, fusion, dense, safety,
          readThresholds(dir), SlotFields.read(dir.slotFields()), new OpenTimes(millis(t1 - t0),
              millis(t3 - t2), millis(t2 - t1 - (deferReranker || scorer == null ? 0 : scorer.loadNanos())),
              millis(denseNanos[0])));
    } catch (IOException | RuntimeException | InterruptedException e) {
      if (dense == null) {
        try {
          dense = joined(opening);
        } catch (IOException | RuntimeException ignored) {
          // The opening's own failure is the one reported.
        }
      }
      if (dense != null) {
        dense.close();
      }
      if (retriever != null) {
        retriever.close();
      }
      if (e instanceof InterruptedException) {
        Thread.currentThread().interrupt();
        throw new IOException("interrupted while opening " + dir.root(), e);
      }
      if (e instanceof IOException io) {
        throw io;
      }
      throw (RuntimeException) e;
    }
  }

  /** The dense leg the opening thread made, its failure rethrown as it was. */
  private static DenseLeg joined(CompletableFuture<DenseLeg> opening) throws IOException {
    try {
      return opening.join();
    } catch (java.util.concurrent.CompletionException e) {
      Throwable cause = e.getCause();
      if (cause instanceof IOException io) {
        throw io;
      }
      if (cause instanceof RuntimeException r) {
        throw r;
      }
      if (cause instanceof Error err) {
        throw err;
      }
      throw new IOException(cause);
    }
  }

  private static long millis(long nanos) {
    return Math.round(nanos / 1e6);
  }

  /** How long opening took, part by part (the reranker's load apart: {@link #rerankerLoad}). */
  public OpenTimes openTimes() {
    return openTimes;
  }

  /**
   * How long loading the reranker's network took in milliseconds, or empty when it has not been
   * loaded (opened with {@link #openRerankerOnFirstUse} and no decision needed it yet).
   */
  public java.util.OptionalLong rerankerLoad() {
    return scorer != null && scorer.loaded()
        ? java.util.OptionalLong.of(millis(scorer.loadNanos()))
        : java.util.OptionalLong.empty();
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

  /** The pipeline that decides with what is in force, running the reranker as set. */
  public Pipeline pipeline() {
    return pipeline(RerankerUse.fromSetting());
  }

  /** The pipeline that decides with what is in force. */
  public Pipeline pipeline(RerankerUse rerankerUse) {
    return Assembly.pipeline(retriever, scorer, dense, fusion, safety, thresholds, rerankerUse)
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

  /**
   * The reranker, loaded now if it was deferred.
   *
   * @throws IllegalStateException when the version holds no reranker ({@link #hasReranker})
   */
  public Scorer scorer() {
    if (scorer == null) {
      throw new IllegalStateException("model version " + version + " holds no reranker");
    }
    return scorer.get();
  }

  /** Whether the version holds a reranker; one trained without it decides with the faster legs. */
  public boolean hasReranker() {
    return scorer != null;
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
