package org.precedent.api.answers;

import java.util.Comparator;
import java.util.List;
import java.util.Set;
import java.util.function.Predicate;
import java.util.stream.Collectors;

/**
 * What the approval gate does to coverage and precision at a threshold: of held-out tickets the
 * pipeline would answer, only those whose answer is approved are still sent.
 */
public final class LibraryCoverage {
  private LibraryCoverage() {}

  /**
   * One held-out ticket as the pipeline decided it.
   *
   * @param answerGroup the best answer's group, or null
   * @param replied     the pipeline would reply (gate and threshold passed)
   * @param right       the best answer is the ticket's right answer
   */
  public record Asked(String answerGroup, boolean replied, boolean right) {}

  /** Coverage (replies over tickets) and precision (right replies over replies; NaN for none). */
  public record Figures(int tickets, int replied, int right) {
    public double coverage() {
      return tickets == 0 ? Double.NaN : (double) replied / tickets;
    }

    public double precision() {
      return replied == 0 ? Double.NaN : (double) right / replied;
    }
  }

  /** The figures when only answers {@code sendable} accepts are sent. */
  public static Figures of(List<Asked> tickets, Predicate<String> sendable) {
    int replied = 0;
    int right = 0;
    for (Asked a : tickets) {
      if (a.replied() && a.answerGroup() != null && sendable.test(a.answerGroup())) {
        replied++;
        right += a.right() ? 1 : 0;
      }
    }
    return new Figures(tickets.size(), replied, right);
  }

  /** The {@code n} answers with the most past replies: the ones a team would approve first. */
  public static Set<String> mostUsed(List<StoredAnswer> answers, int n) {
    return answers.stream().sorted(Comparator.comparingInt((StoredAnswer a) -> -a.sources().size())
        .thenComparing(StoredAnswer::groupId)).limit(n).map(StoredAnswer::groupId)
        .collect(Collectors.toSet());
  }
}
