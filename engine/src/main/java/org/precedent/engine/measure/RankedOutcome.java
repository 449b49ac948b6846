package org.precedent.engine.measure;

/**
 * Where the right answer ended up in the ranked list proposed for one ticket.
 *
 * @param rankOfRightAnswer 1-based position of the right answer in the list, or 0 when the list did
 *                          not contain it (such a ticket counts as a miss for every ranking measure)
 */
public record RankedOutcome(int rankOfRightAnswer) {
  /** The rank value meaning "the right answer was not in the list". */
  public static final int ABSENT = 0;

  public RankedOutcome {
    if (rankOfRightAnswer < 0) {
      throw new IllegalArgumentException(
          "rank of the right answer is " + rankOfRightAnswer + "; use a 1-based rank, or 0 when absent");
    }
  }

  /** Whether the right answer was anywhere in the list. */
  public boolean found() {
    return rankOfRightAnswer != ABSENT;
  }
}
