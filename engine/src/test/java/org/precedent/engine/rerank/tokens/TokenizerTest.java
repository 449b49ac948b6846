package org.precedent.engine.rerank.tokens;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.junit.jupiter.api.Test;

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
}
