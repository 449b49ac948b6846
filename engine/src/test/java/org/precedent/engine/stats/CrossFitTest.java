package org.precedent.engine.stats;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;

// Grouped k-fold requirements (common practice for cross-validation with dependent examples, e.g.
// Roberts et al. 2017, Ecography 40, on blocked cross-validation): whole groups per fold, balanced.
class CrossFitTest {
  /** Tickets t0..t(g-1) with 1 to 5 candidates each, in a shuffled order. */
  private static List<String> candidates(int groups, long seed) {
    Random random = new Random(seed);
    List<String> ids = new ArrayList<>();
    for (int g = 0; g < groups; g++) {
      int size = 1 + random.nextInt(5);
      for (int c = 0; c < size; c++) {
        ids.add("t" + g);
      }
    }
    Collections.shuffle(ids, random);
    return ids;
  }

  @Test
  void allCandidatesOfATicketShareAFold() {
    List<String> ids = candidates(37, 1);
    int[] folds = CrossFit.folds(ids, 5, 99);
    Map<String, Integer> seen = new HashMap<>();
    for (int i = 0; i < folds.length; i++) {
      Integer earlier = seen.putIfAbsent(ids.get(i), folds[i]);
      assertTrue(earlier == null || earlier == folds[i], "ticket " + ids.get(i) + " split across folds");
      assertTrue(folds[i] >= 0 && folds[i] < 5);
    }
  }

  @Test
  void foldsHoldAlmostEqualNumbersOfTickets() {
    // 37 tickets in 5 folds: 7 or 8 each.
    List<String> ids = candidates(37, 2);
    int[] folds = CrossFit.folds(ids, 5, 7);
    List<Set<String>> ticketsPerFold = new ArrayList<>();
    for (int f = 0; f < 5; f++) {
      ticketsPerFold.add(new HashSet<>());
    }
    for (int i = 0; i < folds.length; i++) {
      ticketsPerFold.get(folds[i]).add(ids.get(i));
    }
    int min = ticketsPerFold.stream().mapToInt(Set::size).min().orElseThrow();
    int max = ticketsPerFold.stream().mapToInt(Set::size).max().orElseThrow();
    assertTrue(max - min <= 1 && min == 7, "sizes " + min + ".." + max);
  }

  @Test
  void theFoldOfATicketDependsOnTheSeedNotTheOrder() {
    List<String> ids = candidates(40, 3);
    List<String> reordered = new ArrayList<>(ids);
    Collections.reverse(reordered);
    Map<String, Integer> first = byTicket(ids, CrossFit.folds(ids, 4, 123));
    assertEquals(first, byTicket(reordered, CrossFit.folds(reordered, 4, 123)));
    assertArrayEquals(CrossFit.folds(ids, 4, 123), CrossFit.folds(ids, 4, 123));
    // 40 tickets dealt into 4 folds: two seeds agreeing everywhere has odds of about 1 in 10^21.
    assertFalse(first.equals(byTicket(ids, CrossFit.folds(ids, 4, 124))));
  }

  @Test
  void everyExampleIsScoredOnceByAModelThatNeverSawIt() {
    // Definition of cross-fitting (Chernozhukov et al. 2018, Econometrics Journal 21, "Double/debiased
    // machine learning", section 3): each score comes from a model fitted on the other folds.
    List<String> ids = candidates(12, 4);
    int[] folds = CrossFit.folds(ids, 3, 5);
    int[] timesScored = new int[ids.size()];
    double[] scores = CrossFit.outOfFold(folds, (training, heldOut) -> {
      Set<Integer> train = new HashSet<>();
      for (int i : training) {
        train.add(i);
      }
      Set<String> trainTickets = new HashSet<>();
      train.forEach(i -> trainTickets.add(ids.get(i)));
      assertEquals(ids.size(), training.length + heldOut.length);
      double[] out = new double[heldOut.length];
      for (int j = 0; j < heldOut.length; j++) {
        assertFalse(train.contains(heldOut[j]));
        assertFalse(trainTickets.contains(ids.get(heldOut[j])), "ticket leaked into training");
        timesScored[heldOut[j]]++;
        out[j] = heldOut[j] * 10.0;
      }
      return out;
    });
    for (int i = 0; i < scores.length; i++) {
      assertEquals(1, timesScored[i]);
      assertEquals(i * 10.0, scores[i]);
    }
  }

  @Test
  void refusesUnusableInput() {
    List<String> ids = List.of("a", "a", "b", "c");
    assertThrows(IllegalArgumentException.class, () -> CrossFit.folds(ids, 1, 0));
    assertThrows(IllegalArgumentException.class, () -> CrossFit.folds(ids, 4, 0));
    assertThrows(IllegalArgumentException.class, () -> CrossFit.folds(Arrays.asList("a", null), 2, 0));
    assertThrows(IllegalArgumentException.class, () -> CrossFit.outOfFold(new int[] {0, 0}, (t, h) -> new double[h.length]));
    assertThrows(IllegalArgumentException.class, () -> CrossFit.outOfFold(new int[] {0, 1}, (t, h) -> new double[0]));
  }

  private static Map<String, Integer> byTicket(List<String> ids, int[] folds) {
    Map<String, Integer> map = new HashMap<>();
    for (int i = 0; i < folds.length; i++) {
      map.put(ids.get(i), folds[i]);
    }
    return map;
  }
}
