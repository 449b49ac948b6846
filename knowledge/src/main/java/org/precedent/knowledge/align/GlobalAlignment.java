package org.precedent.knowledge.align;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import java.util.function.ToIntBiFunction;

/**
 * Global alignment of two token sequences (Needleman and Wunsch 1970) with a linear gap penalty,
 * as set out in Durbin, Eddy, Krogh and Mitchison 1998, section 2.3: F(i, j) is the best score of
 * the first i tokens of one sequence against the first j of the other, the larger of a pair, a gap
 * in the second or a gap in the first; the traceback from F(n, m) gives one optimal alignment. Ties
 * prefer a pair, then a gap in the second sequence, so the result is the same on every run.
 *
 * @param <T> the token type
 */
public final class GlobalAlignment<T> {
  private final ToIntBiFunction<? super T, ? super T> pairScore;
  private final int gapPenalty;

  /**
   * @param pairScore  score of aligning two tokens (higher is better)
   * @param gapPenalty what one token against a gap costs, as a positive number
   */
  public GlobalAlignment(ToIntBiFunction<? super T, ? super T> pairScore, int gapPenalty) {
    this.pairScore = Objects.requireNonNull(pairScore, "pairScore");
    if (gapPenalty < 0) {
      throw new IllegalArgumentException("gap penalty must be zero or positive: " + gapPenalty);
    }
    this.gapPenalty = gapPenalty;
  }

  /**
   * An alignment whose tokens equal one another score {@code match}, others {@code mismatch}.
   */
  public static <T> GlobalAlignment<T> byEquality(int match, int mismatch, int gapPenalty) {
    return new GlobalAlignment<>((a, b) -> Objects.equals(a, b) ? match : mismatch, gapPenalty);
  }

  /**
   * One column of an alignment: two tokens, or one token against a gap (the other side null).
   *
   * @param first  the first sequence's token, or null for a gap
   * @param second the second sequence's token, or null for a gap
   * @param firstIndex  its index in the first sequence, or -1 for a gap
   * @param secondIndex its index in the second sequence, or -1 for a gap
   */
  public record Column<T>(T first, T second, int firstIndex, int secondIndex) {
    /** Whether both sides hold a token. */
    public boolean paired() {
      return firstIndex >= 0 && secondIndex >= 0;
    }
  }

  /** An optimal alignment and its score. */
  public record Result<T>(int score, List<Column<T>> columns) {
    public Result {
      columns = List.copyOf(columns);
    }
  }

  /** Aligns the two sequences end to end. Time and memory are proportional to their product. */
  public Result<T> align(List<? extends T> a, List<? extends T> b) {
    int n = a.size();
    int m = b.size();
    int[][] f = new int[n + 1][m + 1];
    for (int i = 1; i <= n; i++) {
      f[i][0] = -gapPenalty * i;
    }
    for (int j = 1; j <= m; j++) {
      f[0][j] = -gapPenalty * j;
    }
    for (int i = 1; i <= n; i++) {
      for (int j = 1; j <= m; j++) {
        int pair = f[i - 1][j - 1] + pairScore.applyAsInt(a.get(i - 1), b.get(j - 1));
        int gapInSecond = f[i - 1][j] - gapPenalty;
        int gapInFirst = f[i][j - 1] - gapPenalty;
        f[i][j] = Math.max(pair, Math.max(gapInSecond, gapInFirst));
      }
    }
    List<Column<T>> columns = new ArrayList<>();
    int i = n;
    int j = m;
    while (i > 0 || j > 0) {
      if (i > 0 && j > 0
          && f[i][j] == f[i - 1][j - 1] + pairScore.applyAsInt(a.get(i - 1), b.get(j - 1))) {
        columns.add(new Column<>(a.get(i - 1), b.get(j - 1), i - 1, j - 1));
        i--;
        j--;
      } else if (i > 0 && f[i][j] == f[i - 1][j] - gapPenalty) {
        columns.add(new Column<>(a.get(i - 1), null, i - 1, -1));
        i--;
      } else {
        columns.add(new Column<>(null, b.get(j - 1), -1, j - 1));
        j--;
      }
    }
    Collections.reverse(columns);
    return new Result<>(f[n][m], columns);
  }
}
