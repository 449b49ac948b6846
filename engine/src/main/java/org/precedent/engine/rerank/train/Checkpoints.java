package org.precedent.engine.rerank.train;

import java.io.IOException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import org.deeplearning4j.nn.graph.ComputationGraph;
import org.deeplearning4j.util.ModelSerializer;
import org.precedent.engine.rerank.ModelLoadException;
import org.precedent.engine.rerank.PropertiesRecords;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.knowledge.io.AtomicFiles;
import org.precedent.engine.rerank.tokens.Vocabulary;

/**
 * The files of an unfinished training run, each replaced atomically.
 *
 * <p>Order of writes keeps them consistent after a crash at any point: a checkpoint's weights (with the
 * Adam state) go to a new numbered zip first, then {@value #STATE} is switched to name that zip and its
 * SHA-256, and only then are older zips deleted. A crash in between leaves the previous state naming the
 * previous zip, both intact; an orphaned newer zip is removed on the next save.
 */
final class Checkpoints {

  static final String STATE = "checkpoint.properties";
  static final String BEST = "best.zip";
  static final String VOCABULARY = "vocab.txt";
  static final String CONFIG = "config.properties";
  private static final String PREFIX = "checkpoint-";

  private final Path dir;

  Checkpoints(Path dir) {
    this.dir = dir;
  }

  boolean exists() {
    return Files.isRegularFile(dir.resolve(STATE));
  }

  /** Removes an earlier run's files and records this run's settings and vocabulary. */
  void begin(RerankerConfig config, Vocabulary vocabulary) throws IOException {
    Files.createDirectories(dir);
    Files.deleteIfExists(dir.resolve(STATE));
    deleteZipsExcept("");
    Files.deleteIfExists(dir.resolve(BEST));
    AtomicFiles.writeString(dir.resolve(CONFIG), PropertiesRecords.text(config, "reranker configuration"));
    vocabulary.save(dir.resolve(VOCABULARY));
  }

  void save(ComputationGraph graph, TrainingState state) throws IOException {
    String name = String.format("%s%05d-%06d.zip", PREFIX, state.epoch(), state.nextBatch());
    Path zip = dir.resolve(name);
    AtomicFiles.writeVia(zip, tmp -> ModelSerializer.writeModel(graph, tmp.toFile(), true));
    TrainingState named = state.withModel(name, AtomicFiles.sha256(zip));
    AtomicFiles.writeString(dir.resolve(STATE), named.toProperties());
    deleteZipsExcept(name);
  }

  void saveBest(ComputationGraph graph) throws IOException {
    AtomicFiles.writeVia(dir.resolve(BEST), tmp -> ModelSerializer.writeModel(graph, tmp.toFile(), false));
  }

  TrainingState loadState() throws IOException {
    return TrainingState.read(dir.resolve(STATE));
  }

  RerankerConfig loadConfig() throws IOException {
    Path file = dir.resolve(CONFIG);
    return RerankerConfig.fromProperties(PropertiesRecords.load(file), file);
  }

  Vocabulary loadVocabulary() throws IOException {
    return Vocabulary.load(dir.resolve(VOCABULARY));
  }

  /** The checkpoint's network, checked against the SHA-256 recorded when it was written. */
  ComputationGraph loadModel(TrainingState state, boolean withUpdater) throws IOException {
    Path zip = dir.resolve(state.modelFile());
    if (!Files.isRegularFile(zip)) {
      throw new ModelLoadException("checkpoint names " + zip + " but it is missing");
    }
    if (!AtomicFiles.sha256(zip).equals(state.modelSha256())) {
      throw new ModelLoadException("checkpoint weights " + zip + " do not match their recorded checksum"
          + " (corrupt or truncated)");
    }
    return restore(zip, withUpdater);
  }

  boolean hasBest() {
    return Files.isRegularFile(dir.resolve(BEST));
  }

  ComputationGraph loadBest() {
    return restore(dir.resolve(BEST), false);
  }

  static ComputationGraph restore(Path zip, boolean withUpdater) {
    try {
      return ModelSerializer.restoreComputationGraph(zip.toFile(), withUpdater);
    } catch (Exception e) {
      throw new ModelLoadException("cannot read reranker weights from " + zip
          + ": the file is corrupt or truncated (" + e.getClass().getSimpleName() + ": " + e.getMessage() + ")", e);
    }
  }

  private void deleteZipsExcept(String keep) throws IOException {
    try (DirectoryStream<Path> zips = Files.newDirectoryStream(dir, PREFIX + "*.zip")) {
      for (Path zip : zips) {
        if (!zip.getFileName().toString().equals(keep)) {
          Files.deleteIfExists(zip);
        }
      }
    }
  }
}
