package org.precedent.engine.evaluate;

import java.io.IOException;
import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import org.precedent.engine.learn.Splits;
import org.precedent.engine.rerank.RerankerModel;
import org.precedent.engine.rerank.net.InferencePass;
import org.precedent.engine.rerank.net.PairCodec;
import org.precedent.knowledge.group.AnswerGroup;
import org.precedent.knowledge.store.Knowledge;
import org.precedent.knowledge.ticket.Ticket;

/**
 * How close a model version's scores by logits come to its exact scores, on the tickets of the
 * fusion split (never trained on by the reranker) whose answer group is known: mean and 95th
 * percentile of |log Z| over the target steps of (question, its group's answer), for the question
 * and for the empty one the anti-LM reads; and, over 10 candidates per question (its own answer and
 * 9 others drawn with a fixed seed), how often the first candidate is the same both ways, the mean
 * Spearman correlation of the two orders, and how often each way puts the own answer first.
 * log Z = 0 at every step would make the two ways the same.
 */
public final class SelfNormalizationReport {
  private static final int CANDIDATES = 10;

  private SelfNormalizationReport() {}

  /** Prints the figures for {@code model} over at most {@code maxQuestions} questions of the split. */
  public static void print(Knowledge knowledge, RerankerModel model, int maxQuestions, PrintWriter out) {
    InferencePass pass = InferencePass.of(model.network());
    if (!pass.selfNormalized()) {
      out.println("this version was trained with plain softmax: its scores are exact");
      return;
    }
    PairCodec codec = model.codec();
    Map<String, String> groupOf = knowledge.grouping().groupOfTicket();
    Map<String, AnswerGroup> groups = knowledge.grouping().byId();
    List<String> answerIds = new ArrayList<>(groups.keySet());
    answerIds.sort(null);
    List<Ticket> asked = new ArrayList<>();
    for (Ticket t : knowledge.tickets().values()) {
      if (Splits.isFusionTicket(t.id()) && groupOf.get(t.id()) != null) {
        asked.add(t);
      }
    }
    asked.sort((a, b) -> a.id().compareTo(b.id()));
    asked = asked.subList(0, Math.min(maxQuestions, asked.size()));
    Random random = new Random(17);
    List<Double> logZ = new ArrayList<>();
    List<Double> answerLogZ = new ArrayList<>();
    InferencePass.EncodedQuestion empty = pass.encode(codec.emptyQuestion().ids());
    int sameFirst = 0;
    int exactRight = 0;
    int logitRight = 0;
    double spearman = 0;
    for (Ticket t : asked) {
      String own = groupOf.get(t.id());
      List<String> candidates = new ArrayList<>(List.of(own));
      while (candidates.size() < Math.min(CANDIDATES, answerIds.size())) {
        String other = answerIds.get(random.nextInt(answerIds.size()));
        if (!candidates.contains(other)) {
          candidates.add(other);
        }
      }
      List<int[]> ids = new ArrayList<>();
      for (String g : candidates) {
        ids.add(codec.answer(groups.get(g).canonical()).ids());
      }
      InferencePass.EncodedQuestion q = pass.encode(codec.question(t.question()).ids());
      for (double z : pass.logNormalizers(q, List.of(ids.get(0)))) {
        logZ.add(Math.abs(z));
      }
      for (double z : pass.logNormalizers(empty, List.of(ids.get(0)))) {
        answerLogZ.add(Math.abs(z));
      }
      double[] exact = pass.logLikelihoods(q, ids, true);
      double[] byLogits = pass.logLikelihoods(q, ids, false);
      int e = argmax(exact);
      int l = argmax(byLogits);
      sameFirst += e == l ? 1 : 0;
      exactRight += e == 0 ? 1 : 0;
      logitRight += l == 0 ? 1 : 0;
      spearman += spearman(exact, byLogits);
    }
    int n = asked.size();
    out.printf(Locale.ROOT, "self-normalised (alpha %s): %d questions of the fusion split, %d candidates each%n",
        model.config().selfNormalization(), n, CANDIDATES);
    out.printf(Locale.ROOT, "|log Z| given the question: mean %.3f, p95 %.3f over %d steps%n", mean(logZ),
        p95(logZ), logZ.size());
    out.printf(Locale.ROOT, "|log Z| given the empty question (anti-LM): mean %.3f, p95 %.3f%n",
        mean(answerLogZ), p95(answerLogZ));
    out.printf(Locale.ROOT, "first candidate the same by logits as exactly: %.3f; mean Spearman correlation "
        + "of the orders %.3f%n", sameFirst / (double) n, spearman / n);
    out.printf(Locale.ROOT, "own answer first: exactly %.3f, by logits %.3f%n", exactRight / (double) n,
        logitRight / (double) n);
    out.flush();
  }

  private static double mean(List<Double> values) {
    return values.stream().mapToDouble(Double::doubleValue).average().orElse(Double.NaN);
  }

  private static double p95(List<Double> values) {
    double[] sorted = values.stream().mapToDouble(Double::doubleValue).sorted().toArray();
    return sorted.length == 0 ? Double.NaN : sorted[(int) Math.ceil(0.95 * sorted.length) - 1];
  }

  private static int argmax(double[] values) {
    int best = 0;
    for (int i = 1; i < values.length; i++) {
      if (values[i] > values[best]) {
        best = i;
      }
    }
    return best;
  }

  /** Spearman's rank correlation, 1 - 6 sum d^2 / (n (n^2 - 1)) (no ties among float sums in practice). */
  static double spearman(double[] a, double[] b) {
    int n = a.length;
    double[] ra = ranks(a);
    double[] rb = ranks(b);
    double d2 = 0;
    for (int i = 0; i < n; i++) {
      d2 += (ra[i] - rb[i]) * (ra[i] - rb[i]);
    }
    return n < 2 ? 1 : 1 - 6 * d2 / (n * ((double) n * n - 1));
  }

  private static double[] ranks(double[] values) {
    Integer[] order = new Integer[values.length];
    for (int i = 0; i < order.length; i++) {
      order[i] = i;
    }
    Arrays.sort(order, (x, y) -> Double.compare(values[x], values[y]));
    double[] ranks = new double[values.length];
    for (int r = 0; r < order.length; r++) {
      ranks[order[r]] = r;
    }
    return ranks;
  }
}
