package org.precedent.knowledge.embed;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.precedent.knowledge.datasets.Clinc150;

/**
 * Frozen embeddings classify CLINC150 (Larson et al. 2019) by a nearest-neighbour vote over the train
 * split's vectors: no training, so this measures the pretrained encoder as it ships.
 */
class ClincNeighboursTest {
  /** Neighbours in the vote: common practice for kNN over sentence embeddings, not tuned here. */
  private static final int K = 10;

  /** Accuracy of the nearest neighbour and of the cosine-weighted vote of the K nearest. */
  record Accuracy(double nearest, double vote) {}

  @Test
  void bankingNeighbourVoteBeatsBm25() throws Exception {
    Clinc150 clinc = Clinc150.load();
    Accuracy a = classify(clinc, "banking", clinc.intents("banking"));
    // BM25 top-1 on the same split is 0.860 (ClincRecallTest, DEVELOPERS.md); issue 8's probe
    // measured a 93.1% kNN vote with this encoder on another intent dataset. Measured here: vote
    // 0.960, 1-NN 0.942. Floors three points lower (about two standard errors on 450 questions,
    // sqrt(0.96 * 0.04 / 450) = 0.009, plus room for another ONNX Runtime build), which is still
    // seven points above BM25: an encoder no better than BM25 here fails.
    assertTrue(a.vote() >= 0.93, "kNN vote accuracy " + a);
    assertTrue(a.nearest() >= 0.91, "1-NN accuracy " + a);
  }

  @Test
  @Tag("slow")
  void allInScopeIntentsNeighbourVoteBeatsBm25() throws Exception {
    Clinc150 clinc = Clinc150.load();
    Accuracy a = classify(clinc, "in-scope", null);
    // Larson et al. 2019, Table 2 (full, in-scope accuracy): BERT fine-tuned 96.2; issue 8 measured
    // BM25 top-1 0.755 on the same split. Measured here: vote 0.930, 1-NN 0.915 (about 2 minutes
    // on 2 shared cores, hence "slow"). Floor 0.90: three points under the vote (its standard error
    // on 4,500 questions is 0.004) and fourteen above BM25.
    assertTrue(a.vote() >= 0.90, "kNN vote accuracy " + a);
  }

  private static Accuracy classify(Clinc150 clinc, String name, Set<String> intents)
      throws Exception {
    List<Clinc150.Example> train = clinc.split("train", intents);
    List<Clinc150.Example> test = clinc.split("test", intents);
    try (SentenceEncoder encoder = SentenceEncoder.open()) {
      long start = System.nanoTime();
      List<float[]> trainV = embed(encoder, train);
      List<float[]> testV = embed(encoder, test);
      double ms = (System.nanoTime() - start) / 1e6 / (train.size() + test.size());
      int right1 = 0;
      int rightK = 0;
      for (int q = 0; q < test.size(); q++) {
        int[] top = nearest(testV.get(q), trainV, K);
        String gold = test.get(q).intent();
        right1 += train.get(top[0]).intent().equals(gold) ? 1 : 0;
        Map<String, Double> votes = new HashMap<>();
        for (int i : top) {
          votes.merge(train.get(i).intent(), dot(testV.get(q), trainV.get(i)), Double::sum);
        }
        String best = votes.entrySet().stream().max(Map.Entry.comparingByValue()).get().getKey();
        rightK += best.equals(gold) ? 1 : 0;
      }
      Accuracy a = new Accuracy((double) right1 / test.size(), (double) rightK / test.size());
      System.out.printf("CLINC150 %s test (%d questions, %d train): 1-NN %.3f, %d-NN cosine vote"
          + " %.3f; %.1f ms of wall time per text on 2 threads, %.1f s in all%n", name, test.size(),
          train.size(), a.nearest(), K, a.vote(), ms, (System.nanoTime() - start) / 1e9);
      return a;
    }
  }

  /** Embeds on two threads, as a caller uses both cores (one ONNX Runtime thread per call). */
  static List<float[]> embed(SentenceEncoder encoder, List<Clinc150.Example> examples)
      throws Exception {
    int threads = 2;
    ExecutorService pool = Executors.newFixedThreadPool(threads);
    try {
      List<Future<List<float[]>>> parts = new ArrayList<>();
      int chunk = (examples.size() + threads - 1) / threads;
      for (int from = 0; from < examples.size(); from += chunk) {
        List<String> texts = examples.subList(from, Math.min(examples.size(), from + chunk))
            .stream().map(Clinc150.Example::query).toList();
        parts.add(pool.submit(() -> encoder.embedAll(texts)));
      }
      List<float[]> out = new ArrayList<>(examples.size());
      for (Future<List<float[]>> f : parts) {
        out.addAll(f.get());
      }
      return out;
    } finally {
      pool.shutdown();
    }
  }

  static double dot(float[] a, float[] b) {
    double s = 0;
    for (int i = 0; i < a.length; i++) {
      s += (double) a[i] * b[i];
    }
    return s;
  }

  /** Indices of the k vectors of highest cosine (all unit vectors, so the dot product). */
  static int[] nearest(float[] q, List<float[]> pool, int k) {
    int[] top = new int[k];
    double[] score = new double[k];
    java.util.Arrays.fill(score, Double.NEGATIVE_INFINITY);
    for (int i = 0; i < pool.size(); i++) {
      double s = dot(q, pool.get(i));
      if (s > score[k - 1]) {
        int j = k - 1;
        while (j > 0 && score[j - 1] < s) {
          score[j] = score[j - 1];
          top[j] = top[j - 1];
          j--;
        }
        score[j] = s;
        top[j] = i;
      }
    }
    return top;
  }
}
