package org.precedent.engine.evaluate;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.fasterxml.jackson.datatype.jsr310.JavaTimeModule;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HexFormat;
import java.util.Optional;
import org.precedent.engine.rerank.ModelLoadException;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.knowledge.io.AtomicFiles;

/**
 * Comparison files: {@code models/CANDIDATE/comparisons/IN-FORCE.json}, written by {@code
 * evaluate} and read by every activation. A version's manifest is made before any comparison of
 * it exists, so each file carries its own SHA-256 (of the comparison's compact JSON) beside it;
 * a file whose content no longer matches it, that names another version than where it lies, or
 * that holds a field the comparison does not have, is refused by name. The file is written
 * whole (temporary file and rename) and left read-only: a later evaluation against the same
 * version replaces it by another whole file, never edits it.
 */
public final class VersionComparisons {
  private static final ObjectMapper JSON = new ObjectMapper()
      .registerModule(new JavaTimeModule())
      .disable(SerializationFeature.WRITE_DATES_AS_TIMESTAMPS)
      .enable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES)
      .enable(DeserializationFeature.FAIL_ON_NULL_FOR_PRIMITIVES);

  private VersionComparisons() {}

  /** Where the comparison of {@code candidate} with {@code inForce} lies. */
  public static Path file(ModelStore store, String candidate, String inForce) {
    // Both names pass the store's check of a version name, so neither can leave the directory.
    store.directory(inForce);
    return store.directory(candidate).resolve(ModelStore.COMPARISONS).resolve(inForce + ".json");
  }

  /** Writes the comparison into its candidate's directory, atomically, read-only. */
  public static Path write(ModelStore store, VersionComparison c) throws IOException {
    Path target = file(store, c.candidate(), c.inForce());
    AtomicFiles.createPrivateDirectories(target.getParent());
    ObjectNode root = JSON.createObjectNode();
    root.put("sha256", sha256(c));
    root.set("comparison", JSON.valueToTree(c));
    byte[] bytes = JSON.writerWithDefaultPrettyPrinter().writeValueAsBytes(root);
    AtomicFiles.write(target, out -> out.write(bytes));
    try {
      Files.setPosixFilePermissions(target,
          java.nio.file.attribute.PosixFilePermissions.fromString("r--------"));
    } catch (UnsupportedOperationException e) {
      // not a POSIX file system: its checksum still tells an edit
    }
    return target;
  }

  /**
   * The comparison of {@code candidate} with {@code inForce}, if evaluate made one.
   *
   * @throws ModelLoadException naming the file when it is unreadable, edited or misplaced
   */
  public static Optional<VersionComparison> read(ModelStore store, String candidate,
      String inForce) throws IOException {
    Path file = file(store, candidate, inForce);
    if (!Files.exists(file)) {
      return Optional.empty();
    }
    VersionComparison c;
    String recorded;
    try {
      JsonNode root = JSON.readTree(file.toFile());
      if (root == null || !root.path("sha256").isTextual() || !root.has("comparison")
          || root.size() != 2) {
        throw refused(file, "it does not hold a comparison and its checksum");
      }
      recorded = root.get("sha256").asText();
      c = JSON.treeToValue(root.get("comparison"), VersionComparison.class);
    } catch (JsonProcessingException | IllegalArgumentException | NullPointerException e) {
      throw refused(file, "it cannot be read (" + (e instanceof JsonProcessingException j
          ? j.getOriginalMessage() : e.getMessage()) + ")");
    }
    if (!recorded.equals(sha256(c))) {
      throw refused(file, "its content no longer matches its SHA-256: it was changed after "
          + "evaluate wrote it");
    }
    if (!c.candidate().equals(candidate) || !c.inForce().equals(inForce)) {
      throw refused(file, "it compares " + c.candidate() + " with " + c.inForce()
          + ", not " + candidate + " with " + inForce);
    }
    return Optional.of(c);
  }

  /** The comparison as one line of JSON, as the audit record keeps it. */
  public static String compact(VersionComparison c) {
    try {
      return JSON.writeValueAsString(c);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException(e);
    }
  }

  private static ModelLoadException refused(Path file, String why) {
    return new ModelLoadException("comparison file " + file + " is refused: " + why + "; run "
        + "'precedent evaluate FILE' again to compare the versions anew");
  }

  private static String sha256(VersionComparison c) throws JsonProcessingException {
    var digest = AtomicFiles.sha256();
    return HexFormat.of().formatHex(digest.digest(JSON.writeValueAsBytes(c)));
  }
}
