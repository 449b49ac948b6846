package org.precedent.knowledge.clean;

import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Redacts payment-card numbers: 13 to 19 digits (ISO/IEC 7812-1 allows up to 19; 13 is the
 * shortest length still seen, from memory), written whole or in groups separated by single spaces
 * or hyphens, and passing the Luhn check. A run of digit groups may hold more than a card (a date
 * or an account number typed next to it), so the card is looked for among whole groups inside the
 * run, preferring the usual card groupings, then the longest span, then the leftmost.
 */
final class CardRule implements Redactor.Rule {
  static final int MIN_DIGITS = 13;
  static final int MAX_DIGITS = 19;

  private static final Pattern RUN = Pattern.compile("\\d++(?:[ -]\\d++)*+");

  @Override
  public String apply(String text) {
    if (!Scan.hasDigits(text, MIN_DIGITS)) {
      return text;
    }
    Matcher m = RUN.matcher(text);
    StringBuilder out = null;
    int copied = 0;
    while (m.find()) {
      // A run right after '+' is an international phone number; the phone rule owns it.
      if (m.end() - m.start() < MIN_DIGITS || (m.start() > 0 && text.charAt(m.start() - 1) == '+')) {
        continue;
      }
      List<int[]> groups = groups(text, m.start(), m.end());
      List<int[]> cards = new ArrayList<>();
      findCards(text, groups, 0, groups.size(), cards);
      cards.sort((a, b) -> Integer.compare(a[0], b[0]));
      for (int[] card : cards) {
        if (out == null) {
          out = new StringBuilder(text.length());
        }
        out.append(text, copied, card[0]).append(Placeholders.CARD);
        copied = card[1];
      }
    }
    if (out == null) {
      return text;
    }
    return out.append(text, copied, text.length()).toString();
  }

  /** The [start, end) character offsets of each digit group in the run. */
  private static List<int[]> groups(String text, int from, int to) {
    List<int[]> groups = new ArrayList<>();
    int i = from;
    while (i < to) {
      int j = i;
      while (j < to && Character.isDigit(text.charAt(j))) {
        j++;
      }
      groups.add(new int[] {i, j});
      i = j + 1; // skip the single separator
    }
    return groups;
  }

  /**
   * Picks cards among groups [lo, hi) window by window. A card spans at most 19 groups, so every
   * span starting in the first 19 groups of a 38-group window lies inside it; the work per group
   * is bounded however long the run (a table of numbers, say).
   */
  private static void findCards(String text, List<int[]> groups, int lo, int hi, List<int[]> cards) {
    int from = lo;
    while (from < hi) {
      int windowEnd = Math.min(hi, from + 2 * MAX_DIGITS);
      int[] best = bestSpan(text, groups, from, windowEnd);
      if (best == null) {
        if (windowEnd == hi) {
          return;
        }
        from += MAX_DIGITS;
        continue;
      }
      cards.add(new int[] {groups.get(best[0])[0], groups.get(best[1])[1]});
      findCards(text, groups, from, best[0], cards); // what lies left of it in this window
      from = best[1] + 1;
    }
  }

  /** The preferred Luhn-valid span of groups in [lo, hi) as {first, last} group, or null. */
  private static int[] bestSpan(String text, List<int[]> groups, int lo, int hi) {
    int[] best = null;
    int bestScore = -1;
    for (int i = lo; i < hi; i++) {
      int digits = 0;
      for (int j = i; j < hi; j++) {
        digits += len(groups, j);
        if (digits > MAX_DIGITS) {
          break;
        }
        if (digits < MIN_DIGITS) {
          continue;
        }
        int score = (cardShaped(groups, i, j) ? 100 : 0) + digits;
        if (score > bestScore && Luhn.isValid(text.substring(groups.get(i)[0], groups.get(j)[1]))) {
          best = new int[] {i, j};
          bestScore = score;
        }
      }
    }
    return best;
  }

  /**
   * Whether the groups look like a printed card number: one unbroken run, fours with a shorter
   * tail (4-4-4-4, 4-4-4-4-3), or the 4-6-5 / 4-6-4 layout of 15- and 14-digit cards (from
   * memory; common practice on printed cards).
   */
  private static boolean cardShaped(List<int[]> groups, int i, int j) {
    if (i == j) {
      return true;
    }
    if (j - i == 2 && len(groups, i) == 4 && len(groups, i + 1) == 6) {
      int last = len(groups, j);
      if (last == 5 || last == 4) {
        return true;
      }
    }
    for (int k = i; k < j; k++) {
      if (len(groups, k) != 4) {
        return false;
      }
    }
    return len(groups, j) <= 4;
  }

  private static int len(List<int[]> groups, int k) {
    return groups.get(k)[1] - groups.get(k)[0];
  }
}
