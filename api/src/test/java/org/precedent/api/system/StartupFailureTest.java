package org.precedent.api.system;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.Arrays;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.precedent.api.testing.ChildJvm;
import org.precedent.api.testing.RunningService;
import org.precedent.api.testing.TrainedData;

/**
 * A service that cannot start says which file is at fault and what is wrong with it, in words
 * rather than as a parser's or the framework's message; a damaged or hand-edited model version in
 * force is never served.
 */
class StartupFailureTest {
  Path data;

  @BeforeEach
  void copy() {
    data = TrainedData.copy();
  }

  @AfterEach
  void delete() {
    TrainedData.delete(data);
  }

  private String startFails() {
    RuntimeException e = assertThrows(RuntimeException.class, () -> {
      RunningService s = RunningService.startOn(data);
      s.close();
    });
    String message = e.getMessage();
    System.err.println("start refused: " + message);
    assertFalse(message.contains("Error creating bean"), message);
    return message;
  }

  private Path truncate(Path file) throws IOException {
    try (FileChannel ch = FileChannel.open(file, StandardOpenOption.WRITE)) {
      ch.truncate(ch.size() / 2);
    }
    return file;
  }

  /** The service's database file, made by H2 itself as a first start would. */
  private Path serviceDatabase() throws Exception {
    Path dir = Files.createDirectories(data.resolve("service"));
    try (var c = java.sql.DriverManager.getConnection("jdbc:h2:file:" + dir.resolve("precedent"),
        "sa", ""); var st = c.createStatement()) {
      st.execute("CREATE TABLE IF NOT EXISTS probe (id INT)");
    }
    Path db = dir.resolve("precedent.mv.db");
    assertTrue(Files.isRegularFile(db));
    return db;
  }

  @Test
  void aMalformedThresholdsFileNamesItselfAndTheLine() throws Exception {
    Path file = data.resolve("thresholds.properties");
    Files.writeString(file, "global=0.9000\ncategory.a\\u12=0.5000\n");
    String message = startFails();
    assertTrue(message.contains(file.toString()) && message.contains("line 2")
        && message.contains("\\uxxxx"), message);
  }

  @ParameterizedTest
  @ValueSource(strings = {"fusion.json", "model.zip"})
  void aTruncatedModelFileNamesItself(String name) throws Exception {
    Path file = truncate(data.resolve("models/v-0001").resolve(name));
    String message = startFails();
    assertTrue(message.contains(file.toString()) && message.contains("truncated"), message);
  }

  @Test
  void aHandEditedFusionModelInForceIsNotServed() throws Exception {
    Path fusion = data.resolve("models/v-0001/fusion.json");
    String before = Files.readString(fusion);
    String edited = before.replaceFirst("\"b\" : [-0-9.Ee]+", "\"b\" : -50.0");
    assertNotEquals(before, edited);
    Files.writeString(fusion, edited);
    String message = startFails();
    assertTrue(message.contains(fusion.toString()) && message.contains("changed after")
        && message.contains("in force") && message.contains("precedent train"), message);
  }

  @Test
  void anUnknownRerankerSettingNamesItAndItsValues() {
    String before = System.getProperty("precedent.reranker");
    System.setProperty("precedent.reranker", "sometimes");
    try {
      String message = startFails();
      assertTrue(message.contains("-Dprecedent.reranker=sometimes")
          && message.contains("on-disagreement"), message);
    } finally {
      if (before == null) {
        System.clearProperty("precedent.reranker");
      } else {
        System.setProperty("precedent.reranker", before);
      }
    }
  }

  @Test
  void aReadOnlyDatabaseFileNamesItself() throws Exception {
    Path db = serviceDatabase();
    Files.setPosixFilePermissions(db, PosixFilePermissions.fromString("r--r--r--"));
    String message = startFails();
    assertTrue(message.contains(db.toString()) && message.contains("read-only"), message);
  }

  @Test
  void aCorruptDatabaseFileNamesItself() throws Exception {
    Path db = serviceDatabase();
    byte[] bytes = Files.readAllBytes(db);
    Arrays.fill(bytes, 0, Math.min(bytes.length, 8192), (byte) 'x');
    Files.write(db, bytes);
    String message = startFails();
    assertTrue(message.contains(db.toString()), message);
  }

  @Test
  void theCommandLineSaysItInOneLine() throws Exception {
    Path file = data.resolve("thresholds.properties");
    Files.writeString(file, "global=0.9000\ncategory.a\\u12=0.5000\n");
    Path log = Files.createTempFile("precedent-serve-", ".log");
    try (ChildJvm serve = ChildJvm.start(log, "--data", data.toString(), "serve", "--port",
        "0")) {
      assertNotEquals(0, serve.waitFor());
      String out = Files.readString(log);
      assertTrue(out.lines().anyMatch(line -> line.startsWith("precedent serve: ")
          && line.contains(file.toString()) && line.contains("line 2")), serve.tail());
    } finally {
      Files.deleteIfExists(log);
    }
  }
}
