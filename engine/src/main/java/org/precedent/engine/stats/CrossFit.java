package org.precedent.engine.stats;

import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.TreeSet;

/**
 * Cross-fitting: split examples into k folds and score each fold with a model trained on the
 * others, so a calibrator is fitted on scores the combiner did not see. Scores a model gives its own
 * training data are over-confident, and a calibrator fitted on them would inherit that.
 *
 * <p>Folds are drawn per group (all candidate answers of one ticket share a group id), because
 * candidates of one ticket share its wording; split across folds they would leak the ticket into
 * training.
 */
public final class CrossFit {
  private CrossFit() {}

  /** Scores held-out examples with a model trained on the given training examples. */
  @FunctionalInterface
  public interface FoldScorer {
    /** One score per entry of {@code heldOut}, in the same order. */
    double[] score(int[] training, int[] heldOut);
  }

  /**
   * Fold (0 to k - 1) of each example. The distinct group ids are sorted, shuffled with
   * {@code new Random(seed)} (whose generator the JDK specifies exactly, so the result is the same on
   * any JVM) and dealt round-robin, so fold sizes in groups differ by at most one. The fold of a
   * group depends only on the set of group ids, the seed and k, not on the order of the list.
   *
   * @throws IllegalArgumentException for null ids, k below 2, or fewer distinct groups than k
   */
  public static int[] folds(List<String> groupIds, int k, long seed) {
    if (groupIds == null) {
      throw new IllegalArgumentException("group ids must not be null");
    }
    for (int i = 0; i < groupIds.size(); i++) {
      if (groupIds.get(i) == null) {
        throw new IllegalArgumentException("group id of example " + i + " is null");
      }
    }
    if (k < 2) {
      throw new IllegalArgumentException("cross-fitting needs at least 2 folds; got " + k);
    }
    List<String> groups = new ArrayList<>(new TreeSet<>(groupIds));
    if (groups.size() < k) {
      throw new IllegalArgumentException(
          "cannot make " + k + " non-empty folds from " + groups.size() + " groups");
    }
    Collections.shuffle(groups, new Random(seed));
    Map<String, Integer> foldOfGroup = new HashMap<>();
    for (int g = 0; g < groups.size(); g++) {
      foldOfGroup.put(groups.get(g), g % k);
    }
    int[] folds = new int[groupIds.size()];
    for (int i = 0; i < folds.length; i++) {
      folds[i] = foldOfGroup.get(groupIds.get(i));
    }
    return folds;
  }

  /**
   * Out-of-fold score for every example: for each fold, {@code scorer} is given the indices of all
   * other folds to train on and this fold's indices to score.
   *
   * @throws IllegalArgumentException for negative folds, a single fold, or a scorer that returns the
   *     wrong number of scores or a non-finite one
   */
  public static double[] outOfFold(int[] folds, FoldScorer scorer) {
    if (folds == null || scorer == null) {
      throw new IllegalArgumentException("folds and scorer must not be null");
    }
    int k = 0;
    for (int i = 0; i < folds.length; i++) {
      if (folds[i] < 0) {
        throw new IllegalArgumentException("fold of example " + i + " is negative: " + folds[i]);
      }
      k = Math.max(k, folds[i] + 1);
    }
    if (k < 2) {
      throw new IllegalArgumentException("out-of-fold scores need at least 2 folds; got " + k);
    }
    double[] scores = new double[folds.length];
    for (int fold = 0; fold < k; fold++) {
      int[] heldOut = members(folds, fold, true);
      if (heldOut.length == 0) {
        continue;
      }
      int[] training = members(folds, fold, false);
      double[] foldScores = scorer.score(training, heldOut);
      if (foldScores == null || foldScores.length != heldOut.length) {
        throw new IllegalArgumentException("scorer returned " + (foldScores == null ? "null" : foldScores.length
            + " scores") + " for " + heldOut.length + " held-out examples of fold " + fold);
      }
      Checks.finite(foldScores, "out-of-fold score");
      for (int j = 0; j < heldOut.length; j++) {
        scores[heldOut[j]] = foldScores[j];
      }
    }
    return scores;
  }

  private static int[] members(int[] folds, int fold, boolean inFold) {
    int count = 0;
    for (int f : folds) {
      count += (f == fold) == inFold ? 1 : 0;
    }
    int[] members = new int[count];
    int next = 0;
    for (int i = 0; i < folds.length; i++) {
      if ((folds[i] == fold) == inFold) {
        members[next++] = i;
      }
    }
    return members;
  }
}
