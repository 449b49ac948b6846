package org.precedent.knowledge.retrieve;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Candidate recall@k: the share of questions whose right answer group is among the first k
 * candidates. Recall at the depth a reranker sees is the ceiling of any reranker.
 */
public final class CandidateRecall {
  /** The cut-offs reported. */
  public static final int[] CUTOFFS = {1, 5, 10, 20};

  private CandidateRecall() {}

  /** A question and the id of the answer group that resolved it. */
  public record Case(String question, String rightGroup) {}

  /**
   * Recall@k for each cut-off in {@link #CUTOFFS}, over {@code cases}; questions are searched as
   * given (clean them first).
   */
  public static Map<Integer, Double> measure(Retriever retriever, List<Case> cases,
      Aggregation aggregation) {
    int deepest = Arrays.stream(CUTOFFS).max().orElseThrow();
    RetrievalSettings settings = RetrievalSettings.standard().withCandidates(deepest)
        .withAggregation(aggregation);
    int[] found = new int[CUTOFFS.length];
    for (Case c : cases) {
      List<Candidate> candidates = retriever.retrieve(c.question(), settings).candidates();
      int rank = 0;
      for (Candidate candidate : candidates) {
        if (candidate.group().id().equals(c.rightGroup())) {
          rank = candidate.rank();
          break;
        }
      }
      for (int i = 0; i < CUTOFFS.length; i++) {
        if (rank > 0 && rank <= CUTOFFS[i]) {
          found[i]++;
        }
      }
    }
    Map<Integer, Double> recall = new LinkedHashMap<>();
    for (int i = 0; i < CUTOFFS.length; i++) {
      recall.put(CUTOFFS[i], cases.isEmpty() ? Double.NaN : found[i] / (double) cases.size());
    }
    return recall;
  }
}
