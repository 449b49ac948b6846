package org.precedent.engine.rerank.net;

import java.util.Arrays;
import org.precedent.engine.rerank.tokens.Tokenizer;
import org.precedent.engine.rerank.tokens.Vocabulary;

/** Turns question and answer text into the id sequences the network reads, with the model's limits. */
public final class PairCodec {

  /** Ids of one side of a pair, and whether text was cut to fit. */
  public record Encoded(int[] ids, boolean truncated) {
    public Encoded {
      ids = ids.clone();
    }

    @Override
    public int[] ids() {
      return ids.clone();
    }

    int length() {
      return ids.length;
    }

    int id(int i) {
      return ids[i];
    }
  }

  private final Tokenizer tokenizer;
  private final Vocabulary vocabulary;
  private final int maxQuestionTokens;
  private final int maxAnswerTokens;

  public PairCodec(Tokenizer tokenizer, Vocabulary vocabulary, int maxQuestionTokens, int maxAnswerTokens) {
    this.tokenizer = tokenizer;
    this.vocabulary = vocabulary;
    this.maxQuestionTokens = maxQuestionTokens;
    this.maxAnswerTokens = maxAnswerTokens;
  }

  /**
   * The encoder's input: the first {@code maxQuestionTokens} tokens, then the end token. An empty
   * question is the end token alone, which is how the anti-LM term asks for P(answer).
   */
  public Encoded question(String text) {
    return withEnd(vocabulary.ids(tokenizer.tokenize(text)), maxQuestionTokens);
  }

  /** The empty question: the end token alone. */
  public Encoded emptyQuestion() {
    return new Encoded(new int[] {Vocabulary.END_ID}, false);
  }

  /** The answer's token ids, at most {@code maxAnswerTokens}; no start or end token (the batch adds them). */
  public Encoded answer(String text) {
    int[] ids = vocabulary.ids(tokenizer.tokenize(text));
    boolean cut = ids.length > maxAnswerTokens;
    return new Encoded(cut ? Arrays.copyOf(ids, maxAnswerTokens) : ids, cut);
  }

  private static Encoded withEnd(int[] ids, int max) {
    boolean cut = ids.length > max;
    int n = Math.min(ids.length, max);
    int[] out = Arrays.copyOf(ids, n + 1);
    out[n] = Vocabulary.END_ID;
    return new Encoded(out, cut);
  }
}
