package org.precedent.engine.rerank;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Properties;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class PropertiesRecordsTest {

  private final RerankerConfig config = RerankerConfig.defaults().withSizes(8, 16).withLearningRate(1e-2)
      .withSeed(-7L);

  @Test
  void aConfigurationReadsBackEqual(@TempDir Path dir) throws Exception {
    Path file = dir.resolve("config.properties");
    Files.writeString(file, PropertiesRecords.text(config, "reranker configuration"));
    assertEquals(config, PropertiesRecords.read(file, RerankerConfig.class));
  }

  @Test
  void theTextIsWhatJavaUtilPropertiesReads() throws Exception {
    // The format is java.util.Properties' (its load method is the reference): one key per record
    // component, each value in Java's own text form (Double.toString, Long.toString).
    Properties p = new Properties();
    p.load(new StringReader(PropertiesRecords.text(config, "reranker configuration")));
    assertEquals(15, p.size(), p.toString());
    assertEquals(Double.toString(config.learningRate()), p.getProperty("learningRate"));
    assertEquals("-7", p.getProperty("seed"));
    assertEquals("16", p.getProperty("hidden"));
  }

  @Test
  void aBadValueAMissingFieldOrAnUnknownOneIsNamedWithItsFile(@TempDir Path dir) throws Exception {
    assertRefusedNaming(write(dir, "embedding", "eight"), "embedding"); // does not parse
    assertRefusedNaming(write(dir, "batchSize", "0"), "batchSize"); // parses, the record refuses it
    assertRefusedNaming(write(dir, "hidden", null), "hidden"); // missing
    assertRefusedNaming(write(dir, "hiden", "16"), "hiden"); // unknown (a misspelt key)
  }

  @Test
  void aConfigurationWrittenBeforeSelfNormalizationReadsAsPlainSoftmax(@TempDir Path dir) throws Exception {
    Path file = dir.resolve("config.properties");
    RerankerConfig trained = config.withSelfNormalization(0.1);
    Properties p = PropertiesRecords.toProperties(trained);
    assertEquals(trained, RerankerConfig.fromProperties(p, file));
    p.remove(RerankerConfig.SELF_NORMALIZATION); // as every version made before the setting existed
    assertEquals(config, RerankerConfig.fromProperties(p, file));
    assertEquals(0.0, RerankerConfig.fromProperties(p, file).selfNormalization());
    p.setProperty(RerankerConfig.SELF_NORMALIZATION, "-0.1");
    assertNames(assertThrows(ModelLoadException.class, () -> RerankerConfig.fromProperties(p, file)), file,
        "selfNormalization");
    p.setProperty(RerankerConfig.SELF_NORMALIZATION, "0.1");
    p.setProperty("selfNormalisation", "0.1"); // still strict about every other key
    assertNames(assertThrows(ModelLoadException.class, () -> RerankerConfig.fromProperties(p, file)), file,
        "selfNormalisation");
  }

  @Test
  void aNumberBesideTheRecordIsTakenOrNamedWhenBad(@TempDir Path dir) throws Exception {
    Path file = dir.resolve("config.properties");
    Properties p = PropertiesRecords.toProperties(config);
    p.setProperty("antiLmLambda", "0.25");
    assertEquals(0.25, PropertiesRecords.takeDouble(p, "antiLmLambda", 0.0, file));
    assertEquals(config, PropertiesRecords.toRecord(p, RerankerConfig.class, file), "the number is removed");
    assertEquals(0.0, PropertiesRecords.takeDouble(p, "antiLmLambda", 0.0, file), "absent: the default");
    p.setProperty("antiLmLambda", "a quarter");
    ModelLoadException e = assertThrows(ModelLoadException.class,
        () -> PropertiesRecords.takeDouble(p, "antiLmLambda", 0.0, file));
    assertNames(e, file, "antiLmLambda");
  }

  @Test
  void aMissingFileIsNamed(@TempDir Path dir) {
    Path file = dir.resolve("config.properties");
    ModelLoadException e = assertThrows(ModelLoadException.class,
        () -> PropertiesRecords.read(file, RerankerConfig.class));
    assertTrue(e.getMessage().contains(file.toString()) && e.getMessage().contains("missing"), e.getMessage());
  }

  /** The configuration's file with one key set to {@code value}, or left out when it is null. */
  private Path write(Path dir, String key, String value) throws Exception {
    Properties p = PropertiesRecords.toProperties(config);
    if (value == null) {
      p.remove(key);
    } else {
      p.setProperty(key, value);
    }
    Path file = dir.resolve("config.properties");
    Files.writeString(file, PropertiesRecords.text(p, "reranker configuration"));
    return file;
  }

  private static void assertRefusedNaming(Path file, String field) {
    ModelLoadException e = assertThrows(ModelLoadException.class,
        () -> PropertiesRecords.read(file, RerankerConfig.class));
    assertNames(e, file, field);
  }

  private static void assertNames(ModelLoadException e, Path file, String field) {
    assertTrue(e.getMessage().contains(file.toString()), e.getMessage());
    assertTrue(e.getMessage().contains("'" + field + "'") || e.getMessage().startsWith(file + ": " + field + " "),
        e.getMessage());
  }
}
