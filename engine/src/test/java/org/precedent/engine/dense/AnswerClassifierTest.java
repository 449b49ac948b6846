package org.precedent.engine.dense;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.nd4j.linalg.api.buffer.DataType;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;
import org.precedent.engine.rerank.ModelLoadException;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.datasets.Clinc150;
import org.precedent.knowledge.embed.SentenceEncoder;

class AnswerClassifierTest {

  /**
   * The fit reaches the optimum of its convex objective: there the gradient of the mean
   * cross-entropy plus the L2 penalty is zero (the first-order condition; the gradient is Bishop
   * 2006, eq. 4.109). Probabilities sum to one and a saved classifier reads back equal.
   */
  @Test
  void fitReachesTheOptimumOfItsObjective(@TempDir Path tmp) throws Exception {
    Random random = new Random(7);
    List<float[]> vectors = new ArrayList<>();
    List<String> labels = new ArrayList<>();
    for (int i = 0; i < 300; i++) {
      int group = i % 3;
      float[] v = new float[8];
      for (int j = 0; j < v.length; j++) {
        v[j] = (float) (random.nextGaussian() + (j == group ? 1.5 : 0));
      }
      vectors.add(v);
      labels.add("g" + group);
    }
    double lambda = 0.01;
    AnswerClassifier c = AnswerClassifier.fit("test", "0", vectors, labels, lambda);
    double[][] x = new double[vectors.size()][8];
    double[][] y = new double[vectors.size()][3];
    for (int i = 0; i < x.length; i++) {
      for (int j = 0; j < 8; j++) {
        x[i][j] = (vectors.get(i)[j] - c.mean()[j]) / c.scale()[j];
      }
      y[i][c.groups().indexOf(labels.get(i))] = 1;
    }
    INDArray[] g = AnswerClassifier.gradient(Nd4j.create(x).castTo(DataType.DOUBLE),
        Nd4j.create(y).castTo(DataType.DOUBLE), Nd4j.create(c.weights()).castTo(DataType.DOUBLE),
        Nd4j.create(new double[][] {c.bias()}).castTo(DataType.DOUBLE), lambda);
    double largest = Math.max(g[0].amaxNumber().doubleValue(), g[1].amaxNumber().doubleValue());
    // 1e-3 of a gradient whose entries start near 0.3: common practice for a stopping test, no
    // source.
    assertTrue(largest < 1e-3, "largest gradient entry at the fit: " + largest);
    Map<String, Double> p = c.probabilities(vectors.get(0));
    assertEquals(1.0, p.values().stream().mapToDouble(Double::doubleValue).sum(), 1e-9);
    assertEquals(List.of(0.0), c.probabilities(vectors.get(0), List.of("unknown")));
    c.save(tmp);
    AnswerClassifier back = AnswerClassifier.loadIfPresent(tmp);
    assertEquals(c.probabilities(vectors.get(5)), back.probabilities(vectors.get(5)));
    assertThrows(IllegalArgumentException.class, () -> c.probabilities(new float[3]));
  }

  /** A damaged or hand-edited dense.json is refused, naming the file; none at all means none. */
  @Test
  void aTamperedFileIsRefusedByName(@TempDir Path tmp) throws Exception {
    assertEquals(null, AnswerClassifier.loadIfPresent(tmp));
    Path file = tmp.resolve(AnswerClassifier.FILE);
    Files.writeString(file, "{\"encoder\": \"x\", \"encoderSha256\": \"0\", ");
    ModelLoadException cut = assertThrows(ModelLoadException.class,
        () -> AnswerClassifier.loadIfPresent(tmp));
    assertTrue(cut.getMessage().contains(file.toString()), cut.getMessage());
    // Well-formed JSON whose shapes disagree (two groups, one bias).
    Files.writeString(file, "{\"encoder\": \"x\", \"encoderSha256\": \"0\", \"groups\": "
        + "[\"a\", \"b\"], \"mean\": [0], \"scale\": [1], \"weights\": [[1, 2]], "
        + "\"bias\": [0], \"lambda\": 0.001}");
    ModelLoadException shapes = assertThrows(ModelLoadException.class,
        () -> AnswerClassifier.loadIfPresent(tmp));
    assertTrue(shapes.getMessage().contains("2 groups"), shapes.getMessage());
  }

  /**
   * On CLINC150's banking domain (Larson et al. 2019, read in place) the classifier over frozen
   * bge-small vectors beats BM25's top-1 (0.860 on this split, ClincRecallTest) and the kNN vote
   * over the same vectors (0.960, ClincNeighboursTest) is the figure to be near: issue 8's probe
   * found the regression a little above the vote on another intent dataset (93.2 against 93.1).
   */
  @Test
  void bankingIntentsFromFrozenVectors() throws Exception {
    Clinc150 clinc = Clinc150.load();
    TextCleaner cleaner = TextCleaner.standard();
    var train = clinc.split("train", clinc.intents("banking"));
    var test = clinc.split("test", clinc.intents("banking"));
    try (SentenceEncoder encoder = SentenceEncoder.open()) {
      List<float[]> vectors = new ArrayList<>();
      List<String> labels = new ArrayList<>();
      for (var e : train) {
        vectors.add(encoder.embed(cleaner.cleanQuestion(e.query())));
        labels.add(e.intent());
      }
      AnswerClassifier c = AnswerClassifier.fit(encoder.identity().model(),
          encoder.identity().sha256(), vectors, labels, AnswerClassifier.LAMBDA);
      int right = 0;
      for (var e : test) {
        Map<String, Double> p = c.probabilities(encoder.embed(cleaner.cleanQuestion(e.query())));
        String best = p.entrySet().stream().max(Map.Entry.comparingByValue()).orElseThrow()
            .getKey();
        right += best.equals(e.intent()) ? 1 : 0;
      }
      double accuracy = right / (double) test.size();
      System.out.printf("CLINC150 banking test: answer classifier over frozen vectors top-1 %.3f "
          + "(%d questions)%n", accuracy, test.size());
      // Three points under the vote: about two standard errors on 450 questions plus room.
      assertTrue(accuracy >= 0.93, "accuracy " + accuracy);
    }
  }

  /**
   * The fit's native memory stays bounded: each step's arrays are reused, not left for the garbage
   * collector. Without that, 300 steps over 2,000 questions and 150 groups left about 3 GB of
   * freed-late native arrays (measured here: 6.6 GB resident at 6,000 questions, 0.34 GB with).
   * Random vectors stand in for questions: only the sizes matter here.
   */
  @Test
  void fittingKeepsNativeMemoryBounded() throws Exception {
    Random random = new Random(7);
    List<float[]> vectors = new ArrayList<>();
    List<String> labels = new ArrayList<>();
    for (int i = 0; i < 2000; i++) {
      float[] v = new float[384];
      for (int j = 0; j < v.length; j++) {
        v[j] = (float) random.nextGaussian();
      }
      vectors.add(v);
      labels.add("group-" + (i % 150));
    }
    long before = residentKb();
    AnswerClassifier.fit("probe", "0".repeat(64), vectors, labels, AnswerClassifier.LAMBDA);
    long grown = residentKb() - before;
    assertTrue(grown < 1_000_000, "the fit grew the process by " + grown / 1024 + " MB resident");
  }

  private static long residentKb() throws java.io.IOException {
    for (String line : Files.readAllLines(Path.of("/proc/self/status"))) {
      if (line.startsWith("VmRSS:")) {
        return Long.parseLong(line.replaceAll("[^0-9]", ""));
      }
    }
    throw new IllegalStateException("no VmRSS in /proc/self/status");
  }
}
