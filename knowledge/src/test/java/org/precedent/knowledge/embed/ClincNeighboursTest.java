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
import org.junit.jupiter.api.Test;
import org.precedent.knowledge.testdata.Clinc150;

/**
 * Frozen embeddings classify CLINC150 (Larson et al. 2019) by a nearest-neighbour vote over the train
 * split's vectors: no training, so this measures the pretrained encoder as it ships.
 */
class ClincNeighboursTest {
  /** Neighbours in the vote: common practice for kNN over sentence embeddings, not tuned here. */
  private static final int K = 10;

  @Test
  void bankingNeighbourVoteBeatsBm25() throws Exception {
    Clinc150 clinc = Clinc150.load();
    Set<String> banking = clinc.intents("banking");
    List<Clinc150.Example> train = clinc.split("train", banking);
    List<Clinc150.Example> test = clinc.split("test", banking);
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
      double acc1 = (double) right1 / test.size();
      double accK = (double) rightK / test.size();
      System.out.printf("CLINC150 banking test (%d questions, %d train): 1-NN %.3f, %d-NN cosine"
          + " vote %.3f; %.1f ms of wall time per text on 2 threads%n", test.size(), train.size(),
          acc1, K, accK, ms);
      // BM25 top-1 on the same split is 0.860 (ClincRecallTest, DEVELOPERS.md); issue 8's probe
      // measured a 93.1% kNN vote with this encoder on another intent dataset. Measured here: vote
      // 0.960, 1-NN 0.942. Floors three points lower (about two standard errors on 450 questions,
      // sqrt(0.96 * 0.04 / 450) = 0.009, plus room for another ONNX Runtime build), which is still
      // seven points above BM25: an encoder no better than BM25 here fails.
      assertTrue(accK >= 0.93, "kNN vote accuracy " + accK);
      assertTrue(acc1 >= 0.91, "1-NN accuracy " + acc1);
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
