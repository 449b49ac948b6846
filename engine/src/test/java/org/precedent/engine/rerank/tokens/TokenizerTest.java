package org.precedent.engine.rerank.tokens;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.precedent.engine.hostile.HostileText.onSmallStack;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.precedent.engine.hostile.HostileText.CountingText;

class TokenizerTest {

  private final Tokenizer tokenizer = new Tokenizer();

  @Test
  void lowerCasesWordsAndSplitsOffPunctuation() {
    assertEquals(List.of("why", "was", "my", "card", "blocked", "?", "!"), tokenizer.tokenize("Why was my CARD blocked?!"));
  }

  @Test
  void keepsPlaceholdersWholeAndUpperCase() {
    assertEquals(List.of("send", "it", "to", "[EMAIL]", "or", "call", "[PHONE]", ",", "card", "[CARD]", "iban",
        "[IBAN]", "acct", "[ACCOUNT]", "."),
        tokenizer.tokenize("Send it to [EMAIL] or call [PHONE], card [CARD] IBAN [IBAN] acct [ACCOUNT]."));
  }

  @Test
  void lowerCaseBracketsAreOrdinaryPunctuation() {
    assertEquals(List.of("[", "note", "]"), tokenizer.tokenize("[note]"));
  }

  @Test
  void keepsContractionsAndNumbers() {
    assertEquals(List.of("i", "don't", "have", "42", "€", "."), tokenizer.tokenize("I don\u2019t have 42€."));
  }

  @Test
  void emptyAndNullGiveNoTokens() {
    assertEquals(List.of(), tokenizer.tokenize("   "));
    assertEquals(List.of(), tokenizer.tokenize(null));
  }

  /** A run of apostrophe-joined letters is one word, however long, on a small thread stack. */
  @Test
  void aHundredKilobyteRunOfApostrophesIsOneWordOnASmallStack() throws Exception {
    String run = "a'".repeat(50_000);
    String text = "my bin was not emptied " + run;
    List<String> tokens = onSmallStack(() -> tokenizer.tokenize(text), "a'a'a'...");
    assertEquals(List.of("my", "bin", "was", "not", "emptied", run.substring(0, run.length() - 1), "'"),
        tokens);
  }

  /**
   * Each character is read a bounded number of times, so the time is linear in the text: counted
   * reads, not a clock, so the check holds on a loaded machine.
   */
  @Test
  void readsEachCharacterABoundedNumberOfTimes() {
    String[] units = {"a'", "a\u2019", "ab'cd'", "'", "[A", "[AB_1", "[", "a", "1", "a' ", "\u00a0", "x'y "};
    for (String unit : units) {
      CountingText text = new CountingText(unit.repeat(100_000 / unit.length()));
      tokenizer.tokenize(text);
      // Up to five reads a character: decoding it, and telling what may follow it.
      assertTrue(text.reads() <= 5L * text.length(),
          unit + ": " + text.reads() + " reads for " + text.length() + " characters");
    }
  }

  /**
   * The scanner gives exactly the tokens of the regular expression it replaced (the grammar in the
   * class description), on random text over the characters where the two could disagree.
   */
  @Test
  void agreesWithTheTokenGrammarAsARegularExpression() {
    Pattern grammar = Pattern.compile("\\[[A-Z][A-Z0-9_]*\\]"
        + "|[\\p{L}\\p{N}]+(?:['\u2019][\\p{L}]+)*"
        + "|[^\\s\\p{L}\\p{N}]");
    String[] alphabet = {"a", "Z", "é", "ß", "İ", "1", "٣", "Ⅻ", "½", "'", "\u2019", "[", "]", "A", "B", "_",
        "9", " ", "\t", "\n", "\u00a0", "\u2028", ".", "?", "€", "\ud83d\ude00", "\ud835\udc00", "\ud800", "-"};
    Random random = new Random(20240611);
    for (int round = 0; round < 20_000; round++) {
      StringBuilder b = new StringBuilder();
      int length = 1 + random.nextInt(12);
      for (int k = 0; k < length; k++) {
        b.append(alphabet[random.nextInt(alphabet.length)]);
      }
      String text = b.toString();
      List<String> expected = new ArrayList<>();
      Matcher m = grammar.matcher(text);
      while (m.find()) {
        String t = m.group();
        expected.add(Tokenizer.isPlaceholder(t) ? t : t.toLowerCase(Locale.ROOT).replace('\u2019', '\''));
      }
      assertEquals(expected, tokenizer.tokenize(text), () -> "text: " + escaped(text));
    }
  }

  private static String escaped(String s) {
    StringBuilder b = new StringBuilder();
    s.chars().forEach(c -> b.append(c < 128 && c >= 32 ? String.valueOf((char) c) : String.format("\\u%04x", c)));
    return b.toString();
  }
}
