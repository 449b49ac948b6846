package org.precedent.engine.fusion;

import java.util.ArrayList;
import java.util.List;
import org.precedent.engine.candidates.CandidateScoring;
import org.precedent.engine.rerank.AnswerScore;
import org.precedent.knowledge.retrieve.Candidate;

/**
 * The features of each candidate answer that fusion learns from: what BM25 says, what the reranker
 * says, what the dense leg says, and how far each candidate stands from the others. Margins and
 * shares matter as much as raw scores: a confident answer is one that stands clear of its
 * runner-up.
 */
final class Features {
  /** BM25 features. */
  static final List<String> BM25 = List.of("bm25", "bm25_inverse_rank", "bm25_margin", "bm25_share",
      "log_hits", "log_support");
  /** Reranker features. */
  static final List<String> RERANKER = List.of("rerank_anti_lm", "rerank_per_token",
      "rerank_inverse_rank", "rerank_margin", "rerank_share");
  /**
   * Dense-leg features: the cosine of the group's nearest past question and its lead over the
   * other candidates', the group's share of the nearest past tickets, and the answer classifier's
   * probability and its lead. All 0 without a dense leg.
   */
  static final List<String> DENSE = List.of("dense_nearest", "dense_nearest_margin", "dense_vote",
      "dense_probability", "dense_probability_margin");
  /** All features: BM25, reranker, dense. */
  static final List<String> ALL;

  static {
    List<String> all = new ArrayList<>(BM25);
    all.addAll(RERANKER);
    all.addAll(DENSE);
    ALL = List.copyOf(all);
  }

  private Features() {}

  /**
   * One row of {@link #ALL} per candidate, in the candidates' order; the reranker's features are
   * 0 where it did not run, which only systems without them may then read.
   */
  static double[][] of(CandidateScoring scoring) {
    List<Candidate> candidates = scoring.candidates();
    List<AnswerScore> scores = scoring.scores();
    int n = candidates.size();
    double[] bm25 = new double[n];
    double[] rerank = new double[n];
    double[] nearest = new double[n];
    double[] probability = new double[n];
    for (int i = 0; i < n; i++) {
      bm25[i] = candidates.get(i).score();
      rerank[i] = scores == null ? 0 : scores.get(i).antiLm();
      nearest[i] = candidates.get(i).proximity().nearest();
      probability[i] = scoring.posterior().get(i);
    }
    int[] rerankRank = ranks(rerank);
    double[] bm25Share = softmax(bm25, 1.0);
    double[] rerankShare = softmax(rerank, 1.0);
    double[][] rows = new double[n][];
    for (int i = 0; i < n; i++) {
      Candidate c = candidates.get(i);
      double perToken = scores == null ? 0 : scores.get(i).perTokenLogLikelihood();
      rows[i] = new double[] {
          bm25[i], 1.0 / c.rank(), margin(bm25, i), bm25Share[i],
          Math.log1p(c.hits()), Math.log1p(c.group().size()),
          rerank[i], perToken, 1.0 / rerankRank[i], margin(rerank, i),
          rerankShare[i],
          nearest[i], margin(nearest, i), c.proximity().vote(), probability[i],
          margin(probability, i)};
    }
    return rows;
  }

  /** The entries of one row named in {@code names}. */
  static double[] select(double[] row, List<String> names) {
    return select(new double[][] {row}, names)[0];
  }

  /** The columns of {@code rows} named in {@code names}. */
  static double[][] select(double[][] rows, List<String> names) {
    int[] columns = names.stream().mapToInt(ALL::indexOf).toArray();
    double[][] out = new double[rows.length][columns.length];
    for (int i = 0; i < rows.length; i++) {
      for (int j = 0; j < columns.length; j++) {
        out[i][j] = rows[i][columns[j]];
      }
    }
    return out;
  }

  /** A value minus the best of the others (positive only for a clear leader); 0 when alone. */
  static double margin(double[] values, int i) {
    double bestOther = Double.NEGATIVE_INFINITY;
    for (int j = 0; j < values.length; j++) {
      if (j != i) {
        bestOther = Math.max(bestOther, values[j]);
      }
    }
    return bestOther == Double.NEGATIVE_INFINITY ? 0 : values[i] - bestOther;
  }

  /** 1-based ranks by descending value; ties keep the earlier (BM25) order. */
  static int[] ranks(double[] values) {
    Integer[] order = new Integer[values.length];
    for (int i = 0; i < order.length; i++) {
      order[i] = i;
    }
    java.util.Arrays.sort(order, (a, b) -> Double.compare(values[b], values[a]));
    int[] ranks = new int[values.length];
    for (int r = 0; r < order.length; r++) {
      ranks[order[r]] = r + 1;
    }
    return ranks;
  }

  static double[] softmax(double[] values, double temperature) {
    double max = java.util.Arrays.stream(values).max().orElse(0);
    double[] out = new double[values.length];
    double sum = 0;
    for (int i = 0; i < values.length; i++) {
      out[i] = Math.exp((values[i] - max) / temperature);
      sum += out[i];
    }
    for (int i = 0; i < values.length; i++) {
      out[i] /= sum;
    }
    return out;
  }
}
