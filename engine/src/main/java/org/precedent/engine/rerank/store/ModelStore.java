package org.precedent.engine.rerank.store;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.DirectoryStream;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Properties;
import java.util.regex.Pattern;
import org.deeplearning4j.nn.graph.ComputationGraph;
import org.deeplearning4j.util.ModelSerializer;
import org.precedent.engine.rerank.ModelLoadException;
import org.precedent.engine.rerank.PropertiesRecords;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.engine.rerank.RerankerModel;
import org.precedent.engine.rerank.TrainedReranker;
import org.precedent.engine.rerank.TrainingMetrics;
import org.precedent.knowledge.io.AtomicFiles;
import org.precedent.engine.rerank.tokens.Vocabulary;

/**
 * Saved rerankers, one directory per version ({@code v-0001}, {@code v-0002}, ..) under a root, and an
 * {@value #ACTIVE} file naming the one in use.
 *
 * <p>A version is written whole into a hidden temporary directory and renamed into place, so a crash
 * never leaves a half-written version; {@value #ACTIVE} is switched by atomic rename too. Each version
 * holds the weights ({@value #WEIGHTS}), the vocabulary, the settings with the anti-LM weight, the
 * training metrics and data fingerprint, whatever else the caller writes with it (the fusion model),
 * and a manifest of the SHA-256 of every one of those files. Loading and activating check every file
 * first, so a truncated, damaged or hand-edited file is refused by name rather than failing deep in
 * DL4J or, worse, being used. What is learnt of a version later, its comparisons with other
 * versions ({@value #COMPARISONS}/), lies outside its manifest and checks itself.
 */
public final class ModelStore {

  public static final String ACTIVE = "ACTIVE";
  static final String WEIGHTS = "model.zip";
  static final String VOCABULARY = "vocab.txt";
  static final String CONFIG = "config.properties";
  private static final String ANTI_LM_LAMBDA = "antiLmLambda";
  static final String METRICS = "metrics.json";
  /** The key of {@value #METRICS} that says a version holds no reranker. */
  private static final String RERANKER = "reranker";
  /** The reranker's own files: every version that claims a reranker holds them. */
  private static final List<String> RERANKER_FILES = List.of(WEIGHTS, VOCABULARY, CONFIG);
  static final String MANIFEST = "manifest.properties";
  /**
   * Where evaluations of a version against others are kept: written after the version is made, so
   * outside its manifest (each file carries its own checksum, engine.evaluate.VersionComparisons).
   */
  public static final String COMPARISONS = "comparisons";
  private static final Pattern VERSION = Pattern.compile("v-\\d{4,}");

  private final Path root;

  public ModelStore(Path root) {
    this.root = root;
  }

  /** Saves a trained reranker as the next version and makes it active. Returns the version name. */
  public String save(TrainedReranker trained) throws IOException {
    String version = write(trained);
    activate(version);
    return version;
  }

  /** Saves a trained reranker as the next version without activating it. */
  public String write(TrainedReranker trained) throws IOException {
    return write(trained, dir -> { });
  }

  /** More files of a version, written into its directory before the manifest is made. */
  @FunctionalInterface
  public interface VersionFiles {
    void writeInto(Path versionDir) throws IOException;
  }

  /**
   * Saves a trained reranker and {@code more} files as the next version, without activating it;
   * the manifest covers them all.
   */
  public String write(TrainedReranker trained, VersionFiles more) throws IOException {
    return writeVersion(dir -> {
      writeFiles(dir, trained);
      more.writeInto(dir);
    });
  }

  private String writeVersion(VersionFiles files) throws IOException {
    Files.createDirectories(root);
    Path staging = Files.createTempDirectory(root, ".staging-");
    try {
      // Temporary directories are owner-only; a model version stays so, like the whole data dir.
      try {
        Files.setPosixFilePermissions(staging,
            java.nio.file.attribute.PosixFilePermissions.fromString("rwx------"));
      } catch (UnsupportedOperationException e) {
        // not a POSIX file system: keep its default
      }
      files.writeInto(staging);
      writeManifest(staging);
      while (true) {
        String version = nextVersion();
        try {
          AtomicFiles.move(staging, root.resolve(version));
          return version;
        } catch (FileAlreadyExistsException | java.nio.file.DirectoryNotEmptyException raced) {
          // another writer took this number; try the next one
        }
      }
    } finally {
      AtomicFiles.deleteTree(staging);
    }
  }

  /**
   * Saves a version that holds no reranker: {@code more} files (fusion, the dense leg's
   * classifier) and a {@value #METRICS} that says so ({@code "reranker": false}) beside the
   * fingerprint of the tickets it learnt from; the manifest covers exactly those files. Such a
   * version decides with the faster legs alone, ready long before a reranker is trained.
   */
  public String writeWithoutReranker(String dataFingerprint, VersionFiles more)
      throws IOException {
    return writeVersion(dir -> {
      Map<String, Object> metrics = new LinkedHashMap<>();
      metrics.put("savedAt", Instant.now().toString());
      metrics.put("dataSha256", dataFingerprint);
      metrics.put(RERANKER, false);
      Files.writeString(dir.resolve(METRICS), new ObjectMapper()
          .enable(SerializationFeature.INDENT_OUTPUT).writeValueAsString(metrics),
          StandardCharsets.UTF_8);
      more.writeInto(dir);
    });
  }

  /**
   * Whether a version holds a reranker: every version does unless its {@value #METRICS} says
   * {@code "reranker": false} (versions made before such versions existed say nothing, and all
   * hold one).
   */
  public boolean hasReranker(String version) throws IOException {
    Path metrics = directory(version).resolve(METRICS);
    if (!Files.isRegularFile(metrics)) {
      return true;
    }
    var node = new ObjectMapper().readTree(metrics.toFile()).get(RERANKER);
    return node == null || !node.isBoolean() || node.booleanValue();
  }

  /** Makes {@code version} the active one, once every file of it is checked. */
  public void activate(String version) throws IOException {
    verify(version);
    AtomicFiles.writeString(root.resolve(ACTIVE), version + "\n");
  }

  public Optional<String> activeVersion() throws IOException {
    Path pointer = root.resolve(ACTIVE);
    if (!Files.isRegularFile(pointer)) {
      return Optional.empty();
    }
    return Optional.of(checkName(Files.readString(pointer, StandardCharsets.UTF_8).trim()));
  }

  public List<String> versions() throws IOException {
    List<String> out = new ArrayList<>();
    if (Files.isDirectory(root)) {
      try (DirectoryStream<Path> dirs = Files.newDirectoryStream(root, "v-*")) {
        for (Path d : dirs) {
          if (VERSION.matcher(d.getFileName().toString()).matches() && Files.isDirectory(d)) {
            out.add(d.getFileName().toString());
          }
        }
      }
    }
    out.sort(null);
    return out;
  }

  /** The SHA-256 of the training pairs a version was trained on, as recorded when it was saved. */
  public Optional<String> dataFingerprint(String version) throws IOException {
    Path metrics = directory(version).resolve(METRICS);
    if (!Files.isRegularFile(metrics)) {
      return Optional.empty();
    }
    var node = new ObjectMapper().readTree(metrics.toFile()).get("dataSha256");
    return node == null ? Optional.empty() : Optional.of(node.asText());
  }

  /**
   * The training figures a version was saved with; empty when it has none. Versions saved before the
   * thread counts were recorded give a null {@link TrainingMetrics#computeThreads()}.
   */
  public Optional<TrainingMetrics> trainingMetrics(String version) throws IOException {
    Path metrics = directory(version).resolve(METRICS);
    if (!Files.isRegularFile(metrics)) {
      return Optional.empty();
    }
    var node = new ObjectMapper().readTree(metrics.toFile()).get("metrics");
    if (node == null) {
      return Optional.empty();
    }
    try {
      return Optional.of(new ObjectMapper()
          .disable(com.fasterxml.jackson.databind.DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES)
          .treeToValue(node, TrainingMetrics.class));
    } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
      throw new IOException(metrics + ": unreadable training metrics: " + e.getOriginalMessage(), e);
    }
  }

  /**
   * The SHA-256 of a version's manifest, which holds the SHA-256 of every file of it: one value
   * that names exactly these model files (a comparison records it, to be refused if they change).
   */
  public String fingerprint(String version) throws IOException {
    Path manifest = directory(version).resolve(MANIFEST);
    if (!Files.isRegularFile(manifest)) {
      throw new ModelLoadException("model file " + manifest + " is missing");
    }
    return AtomicFiles.sha256(manifest);
  }

  public Path directory(String version) {
    return root.resolve(checkName(version));
  }

  public RerankerModel loadActive() throws IOException {
    return load(activeVersion().orElseThrow(() -> new ModelLoadException("no active reranker under " + root)));
  }

  /**
   * Loads a version, checking every file against the manifest first ({@link #verify}).
   *
   * @throws ModelLoadException naming the file when one is missing, truncated or damaged, or when the
   *     vocabulary does not fit the network
   */
  public RerankerModel load(String version) throws IOException {
    verify(version);
    if (!hasReranker(version)) {
      throw new ModelLoadException("model version " + version + " holds no reranker (it was "
          + "trained without one: 'precedent train --without-reranker')");
    }
    return read(directory(version));
  }

  /**
   * Checks that every file of a version is in its manifest and has the SHA-256 recorded there, and
   * that every file the manifest lists is there.
   *
   * <p>A version made by an earlier release has a manifest without {@code fusion.json}. It is
   * refused like any other file the manifest does not cover: nothing tells such a file from one
   * edited or put there by hand, and the fusion model sets every confidence, so using it unchecked
   * could turn hand-offs into automatic replies. Training again makes a fully covered version.
   *
   * @throws ModelLoadException naming the first file that fails
   */
  public void verify(String version) throws IOException {
    Path dir = directory(version);
    if (!Files.isDirectory(dir)) {
      throw new ModelLoadException("no reranker version " + version + " under " + root);
    }
    Path manifestFile = dir.resolve(MANIFEST);
    Properties manifest;
    try {
      manifest = PropertiesRecords.load(manifestFile);
    } catch (IllegalArgumentException e) {
      throw new ModelLoadException("model file " + manifestFile + " is damaged (" + e.getMessage()
          + "); train again ('precedent train')", e);
    }
    for (String file : filesOf(dir)) {
      if (manifest.getProperty(file) == null) {
        throw new ModelLoadException("model file " + dir.resolve(file) + " is not in the checksum "
            + "manifest of " + version + ": the version was made by an earlier release, or the file "
            + "was added afterwards; it is not used unchecked. Train a new version with "
            + "'precedent train' (or remove the file if it does not belong there)");
      }
    }
    for (String file : new java.util.TreeSet<>(manifest.stringPropertyNames())) {
      Path path = dir.resolve(file).normalize();
      if (!path.startsWith(dir)) {
        throw new ModelLoadException("model file " + manifestFile + " names a file outside the "
            + "version: '" + file + "'");
      }
      if (!Files.isRegularFile(path)) {
        throw new ModelLoadException("model file " + path + " is missing");
      }
      if (!AtomicFiles.sha256(path).equals(manifest.getProperty(file).strip())) {
        throw new ModelLoadException("model file " + path + " is corrupt or truncated, or was "
            + "changed after the version was made (its SHA-256 differs from " + MANIFEST + ")");
      }
    }
    // Read only now that metrics.json is known to be the file the version was made with.
    if (hasReranker(version)) {
      for (String file : RERANKER_FILES) {
        if (manifest.getProperty(file) == null) {
          throw new ModelLoadException("model file " + dir.resolve(file) + " is missing: "
              + version + " holds a reranker (its " + METRICS + " does not say \"" + RERANKER
              + "\": false), whose files are " + String.join(", ", RERANKER_FILES)
              + "; train again ('precedent train')");
        }
      }
    }
  }

  /**
   * Every regular file under a version's directory but the manifest and the comparisons made of it
   * later ({@value #COMPARISONS}/), as relative paths with '/'.
   */
  private static List<String> filesOf(Path dir) throws IOException {
    List<String> out = new ArrayList<>();
    Path comparisons = dir.resolve(COMPARISONS);
    try (var paths = Files.walk(dir)) {
      for (Path p : paths.toList()) {
        if (!Files.isDirectory(p) && !p.startsWith(comparisons)) {
          String name = dir.relativize(p).toString().replace('\\', '/');
          if (!name.equals(MANIFEST)) {
            out.add(name);
          }
        }
      }
    }
    out.sort(null);
    return out;
  }

  /** Reads a version's files without the manifest check (for tests and diagnostics of damaged files). */
  static RerankerModel read(Path dir) throws IOException {
    Vocabulary vocabulary;
    try {
      vocabulary = Vocabulary.load(dir.resolve(VOCABULARY));
    } catch (IOException e) {
      throw new ModelLoadException(e.getMessage(), e);
    }
    Path configFile = dir.resolve(CONFIG);
    Properties config = PropertiesRecords.load(configFile);
    // The anti-LM weight, chosen after training, sits beside the configuration the network was built
    // with; versions without it score with log P(a|q) alone.
    double lambda = PropertiesRecords.takeDouble(config, ANTI_LM_LAMBDA, 0.0, configFile);
    RerankerConfig rerankerConfig = RerankerConfig.fromProperties(config, configFile);
    ComputationGraph graph;
    try {
      graph = ModelSerializer.restoreComputationGraph(dir.resolve(WEIGHTS).toFile(), false);
    } catch (Exception e) {
      throw new ModelLoadException("cannot read reranker weights " + dir.resolve(WEIGHTS)
          + ": the file is corrupt or truncated (" + e.getClass().getSimpleName() + ")", e);
    }
    return new RerankerModel(graph, vocabulary, rerankerConfig, lambda);
  }

  private static void writeFiles(Path dir, TrainedReranker trained) throws IOException {
    RerankerModel model = trained.model();
    ModelSerializer.writeModel(model.network(), dir.resolve(WEIGHTS).toFile(), false);
    model.vocabulary().save(dir.resolve(VOCABULARY));
    Properties config = PropertiesRecords.toProperties(model.config());
    config.setProperty(ANTI_LM_LAMBDA, Double.toString(model.antiLmLambda()));
    Files.writeString(dir.resolve(CONFIG), PropertiesRecords.text(config, "reranker configuration"),
        StandardCharsets.UTF_8);
    Map<String, Object> metrics = new LinkedHashMap<>();
    metrics.put("savedAt", Instant.now().toString());
    metrics.put("dataSha256", trained.dataFingerprint());
    metrics.put("metrics", trained.metrics());
    String json = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT).writeValueAsString(metrics);
    Files.writeString(dir.resolve(METRICS), json, StandardCharsets.UTF_8);
  }

  /** The manifest: the SHA-256 of every file written into the version, each forced to disk. */
  private static void writeManifest(Path dir) throws IOException {
    Properties manifest = new Properties();
    for (String file : filesOf(dir)) {
      AtomicFiles.sync(dir.resolve(file));
      manifest.setProperty(file, AtomicFiles.sha256(dir.resolve(file)));
    }
    AtomicFiles.writeString(dir.resolve(MANIFEST),
        PropertiesRecords.text(manifest, "SHA-256 of every file of this model version"));
  }

  private String nextVersion() throws IOException {
    int max = 0;
    for (String v : versions()) {
      max = Math.max(max, Integer.parseInt(v.substring(2)));
    }
    return String.format("v-%04d", max + 1);
  }

  private static String checkName(String version) {
    if (!VERSION.matcher(version).matches()) {
      throw new ModelLoadException("not a reranker version name: '" + version + "'");
    }
    return version;
  }
}
