package org.precedent.engine.measure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;
import org.junit.jupiter.api.Test;

class RankingTest {
  private static final double EPS = 1e-12;

  private static List<RankedOutcome> ranks(int... ranks) {
    return java.util.Arrays.stream(ranks).mapToObj(RankedOutcome::new).toList();
  }

  @Test
  void meanReciprocalRankMatchesTheThreeQueryWorkedExample() {
    // Worked example of the Wikipedia article "Mean reciprocal rank" (three queries whose first
    // correct result sits at ranks 3, 2 and 1): MRR = (1/3 + 1/2 + 1) / 3 = 11/18. From memory.
    assertEquals(11.0 / 18.0, Ranking.meanReciprocalRank(ranks(3, 2, 1)), EPS);
  }

  @Test
  void absentRightAnswerCountsAsZeroReciprocalRankAndAsAMiss() {
    // Reciprocal rank 0 for a question with no correct answer in the list: Voorhees (1999), "The
    // TREC-8 Question Answering Track Report". Hand-computed on ranks 1, 3, absent, 2:
    // MRR = (1 + 1/3 + 0 + 1/2) / 4 = 11/24; top-1 = 1/4; recall@2 = 2/4; recall@3 = 3/4.
    List<RankedOutcome> outcomes = ranks(1, 3, RankedOutcome.ABSENT, 2);
    assertEquals(11.0 / 24.0, Ranking.meanReciprocalRank(outcomes), EPS);
    assertEquals(0.25, Ranking.top1Accuracy(outcomes), EPS);
    assertEquals(0.50, Ranking.recallAt(outcomes, 2), EPS);
    assertEquals(0.75, Ranking.recallAt(outcomes, 3), EPS);
    assertEquals(0.75, Ranking.recallAt(outcomes, 100), EPS);
  }

  @Test
  void rejectsNegativeRankAndNonPositiveK() {
    assertThrows(IllegalArgumentException.class, () -> new RankedOutcome(-1));
    assertThrows(IllegalArgumentException.class, () -> Ranking.recallAt(ranks(1), 0));
  }

  @Test
  void rejectsEmptyInputNamingTheMeasure() {
    IllegalArgumentException e =
        assertThrows(IllegalArgumentException.class, () -> Ranking.meanReciprocalRank(List.of()));
    assertEquals("mean reciprocal rank needs at least one item; the input list is empty", e.getMessage());
  }
}
