package org.precedent.knowledge.align;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;

class GlobalAlignmentTest {

  // BLOSUM50 entries for the letters of the worked example, typed from the published matrix
  // (Henikoff and Henikoff 1992, as printed in Durbin et al. 1998, figure 2.2); from memory of that
  // figure, and the five entries on the alignment below are checked by hand against its score.
  private static final Map<String, Integer> BLOSUM50 = Map.ofEntries(
      Map.entry("AA", 5), Map.entry("AE", -1), Map.entry("AG", 0), Map.entry("AH", -2),
      Map.entry("AP", -1), Map.entry("AW", -3),
      Map.entry("EE", 6), Map.entry("EG", -3), Map.entry("EH", 0), Map.entry("EP", -1),
      Map.entry("EW", -3),
      Map.entry("GH", -2), Map.entry("GP", -2), Map.entry("GW", -3),
      Map.entry("HH", 10), Map.entry("HP", -2), Map.entry("HW", -3),
      Map.entry("WW", 15), Map.entry("PW", -4));

  private static int blosum50(String a, String b) {
    String key = a.compareTo(b) <= 0 ? a + b : b + a;
    Integer score = BLOSUM50.get(key);
    if (score == null) {
      throw new IllegalArgumentException("no BLOSUM50 entry typed for " + key);
    }
    return score;
  }

  private static List<String> letters(String s) {
    return s.chars().mapToObj(c -> String.valueOf((char) c)).collect(Collectors.toList());
  }

  private static String side(GlobalAlignment.Result<String> r, boolean first) {
    return r.columns().stream()
        .map(c -> { String t = first ? c.first() : c.second(); return t == null ? "-" : t; })
        .collect(Collectors.joining());
  }

  @Test
  void durbinWorkedExampleScoresOne() {
    // Durbin, Eddy, Krogh, Mitchison 1998, Biological Sequence Analysis, section 2.3 (figure 2.5):
    // HEAGAWGHEE against PAWHEAE, BLOSUM50, linear gap penalty 8, optimal score 1 (from memory).
    // Verified by hand: HEAGAWGHE-E / --P-AW-HEAE pairs A-P -1, A-A 5, W-W 15, H-H 10, E-E 6,
    // E-E 6 (sum 41) and has 5 gaps (-40): score 1.
    GlobalAlignment<String> align = new GlobalAlignment<>(GlobalAlignmentTest::blosum50, 8);
    GlobalAlignment.Result<String> r = align.align(letters("HEAGAWGHEE"), letters("PAWHEAE"));
    assertEquals(1, r.score());
    assertEquals(rescore("HEAGAWGHE-E", "--P-AW-HEAE"), 1);
    assertEquals(r.score(), rescore(side(r, true), side(r, false)));
  }

  private static int rescore(String a, String b) {
    int s = 0;
    for (int k = 0; k < a.length(); k++) {
      char x = a.charAt(k);
      char y = b.charAt(k);
      s += (x == '-' || y == '-') ? -8 : blosum50(String.valueOf(x), String.valueOf(y));
    }
    return s;
  }

  @Test
  void wordsAlignAroundOneDifference() {
    GlobalAlignment<String> align = GlobalAlignment.byEquality(2, -1, 1);
    GlobalAlignment.Result<String> r = align.align(
        List.of("your", "day", "is", "tuesday"), List.of("your", "bin", "day", "is", "friday"));
    assertEquals(4, r.score());
    assertEquals(5, r.columns().size());
    assertEquals(-1, r.columns().get(1).firstIndex());
    assertEquals("tuesday", r.columns().get(4).first());
    assertEquals("friday", r.columns().get(4).second());
  }
}
