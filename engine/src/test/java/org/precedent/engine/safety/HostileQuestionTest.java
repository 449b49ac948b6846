package org.precedent.engine.safety;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.precedent.engine.hostile.HostileText.onSmallStack;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.regex.Matcher;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.precedent.engine.hostile.HostileText.CountingText;

/**
 * Questions built to hurt a regular expression: long runs of the filler words the rules repeat,
 * after the words that start a rule. Every built-in rule must check them on a small stack, in
 * time linear in their length.
 */
class HostileQuestionTest {

  /** Fillers the rules repeat, each after the words that bring a rule to it. */
  private static final String[][] RUNS = {
      {"water is ", "very "}, {"the water is ", "a bit "}, {"the water tastes ", "and tastes "},
      {"water smells ", "really "}, {"it smells ", "strongly "}, {"water ", "has been "},
      {"the supply ", "might be "}, {"sewage ", "is "}, {"sewage ", "all "}, {"sewage in ", "my "},
      {"water ", "keeps "}, {"leak ", "just "}, {"my son ", "was "}, {"", "a'"}, {"", "water "},
      {"", "sick "}, {"", "water is brown "}, {"", "sewage is coming "}, {"", "x "}, {"", "' "},
      {"", "a-"}, {"", "take you to "}};
  private static final int SIZE = 100_000;

  private static List<String> hostile(int size) {
    List<String> texts = new ArrayList<>();
    for (String[] run : RUNS) {
      StringBuilder b = new StringBuilder("my bin was not emptied and ").append(run[0]);
      while (b.length() < size - 10) {
        b.append(run[1]);
      }
      texts.add(b.append("brown").toString());
    }
    return texts;
  }

  private static SafetyPolicy demo() throws IOException {
    return SafetyPolicy.load(root().resolve("demo-data/safety.rules"));
  }

  @Test
  void aHundredKilobyteQuestionIsCheckedOnASmallStack() throws Exception {
    SafetyPolicy policy = demo();
    for (String text : hostile(SIZE)) {
      onSmallStack(() -> policy.check(text, null, null), text.substring(0, 60) + "...");
    }
  }

  /**
   * Each rule reads the question a number of times proportional to its length: doubling the text
   * at most doubles the reads (with a little slack for the ends). Counted reads, not a clock.
   */
  @Test
  void everyRuleReadsAQuestionInLinearTime() throws IOException {
    SafetyPolicy policy = demo();
    List<String> small = hostile(SIZE / 4);
    List<String> large = hostile(SIZE / 2);
    for (SafetyRule rule : policy.rules()) {
      for (int k = 0; k < small.size(); k++) {
        long a = reads(rule, small.get(k));
        long b = reads(rule, large.get(k));
        assertTrue(b <= 2.2 * a + 1000, rule.id() + " on " + RUNS[k][0] + "(" + RUNS[k][1] + ")...: "
            + a + " reads for " + small.get(k).length() + " characters, " + b + " for twice as many");
      }
    }
  }

  /** A run of fillers as long as real text has them still fires, as it did before the bounds. */
  @ParameterizedTest(name = "{1}: {0}")
  @CsvSource(delimiter = '|', textBlock = """
      the water is very very very very very dark brown            | wq-discoloured
      the water tastes really really really very strongly of bleach | wq-smell-taste
      it smells really quite a bit a little off                   | wq-off-taste
      the water is getting contaminated                           | wq-contaminated
      sewage is all over the garden                               | sewage-flooding
      sewage is now just coming up in my back garden              | sewage-flooding
      sewage was just now all coming into my downstairs front hall | sewage-flooding
      water is just gushing out onto the road                     | burst-water-in-road
      """)
  void fillersStillMatch(String question, String ruleId) throws IOException {
    Optional<SafetyFinding> finding = demo().check(question, null, null);
    assertTrue(finding.isPresent(), () -> "no rule fired on: " + question);
    assertEquals(ruleId, finding.get().ruleId());
  }

  private static long reads(SafetyRule rule, String question) {
    CountingText text = new CountingText(SafetyPolicy.prepare(question));
    Matcher m = rule.pattern().matcher(text);
    while (m.find()) {
      // every match is read, as check would read up to the first
    }
    return text.reads();
  }

  private static Path root() {
    String configured = System.getProperty("precedent.root");
    if (configured != null && Files.isDirectory(Path.of(configured, "demo-data"))) {
      return Path.of(configured);
    }
    return Path.of("..").toAbsolutePath().normalize();
  }
}
