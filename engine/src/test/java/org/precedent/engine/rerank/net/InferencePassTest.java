package org.precedent.engine.rerank.net;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import org.deeplearning4j.nn.graph.ComputationGraph;
import org.junit.jupiter.api.Test;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.engine.rerank.RerankerModel;
import org.precedent.engine.rerank.TinyData;
import org.precedent.engine.rerank.TinyModel;
import org.precedent.engine.rerank.tokens.Tokenizer;
import org.precedent.engine.rerank.tokens.Vocabulary;

/**
 * The plain-Java scoring pass against DL4J's own forward pass on the same network: DL4J is the
 * reference implementation here (its {@code ComputationGraph.output} on the padded, masked batch the
 * scorer used to send, read by {@link LogLikelihoods#perRow}). Both give each candidate's sum of
 * log P(token); they may differ only by float rounding in another order of the sums. The tolerance,
 * 1e-4 nats per candidate for the trained model, is common practice for float32 against float32, no
 * source.
 */
class InferencePassTest {

  @Test
  void trainedModelGivesDl4jLogLikelihoods() {
    RerankerModel model = TinyModel.get().model();
    PairCodec codec = model.codec();
    List<PairCodec.Encoded> questions = new ArrayList<>();
    List<PairCodec.Encoded> answers = new ArrayList<>();
    for (String q : List.of("I forgot my password", "my card is blocked and I need a refund today",
        "delivery?", "")) {
      for (String a : TinyData.ANSWERS) {
        questions.add(q.isEmpty() ? codec.emptyQuestion() : codec.question(q));
        answers.add(codec.answer(a));
      }
    }
    double worst = compare(model.network(), questions, answers);
    assertTrue(worst < 1e-4, "max |difference| " + worst);
  }

  @Test
  void defaultSizedNetworkGivesDl4jLogLikelihoods() {
    // untrained weights at the default size (vocabulary 4,000, hidden 128): large, spread-out
    // logits over the whole vocabulary, the hardest case for the normalisation's rounding
    RerankerConfig config = RerankerConfig.defaults();
    List<String> words = new ArrayList<>();
    for (int i = 0; i < config.vocabCap() - 4; i++) {
      words.add("w" + i);
    }
    Vocabulary vocabulary = Vocabulary.build(List.of(words), config.vocabCap(), 1);
    ComputationGraph graph = Seq2SeqReranker.create(config.network(vocabulary.size()));
    PairCodec codec = new PairCodec(new Tokenizer(), vocabulary, config.maxQuestionTokens(),
        config.maxAnswerTokens());
    Random random = new Random(11);
    String question = text(random, 20);
    List<PairCodec.Encoded> answers = new ArrayList<>();
    for (int i = 0; i < 10; i++) {
      answers.add(codec.answer(text(random, 10 + 4 * i)));
    }
    List<PairCodec.Encoded> questions = new ArrayList<>(Collections.nCopies(10, codec.question(question)));
    double worst = compare(graph, questions, answers);
    // sums of up to 41 log-probabilities near log(1/4000) = -8.3 each: about 340 nats per row, so
    // 1e-3 is three parts in a million
    assertTrue(worst < 1e-4, "max |difference| " + worst);
  }

  @Test
  void refusesAnIdOutsideTheVocabulary() {
    InferencePass pass = InferencePass.of(TinyModel.get().model().network());
    InferencePass.EncodedQuestion q = pass.encode(new int[] {Vocabulary.END_ID});
    org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class,
        () -> pass.logLikelihood(q, new int[] {pass.vocabularySize()}));
  }

  private static double compare(ComputationGraph graph, List<PairCodec.Encoded> questions,
      List<PairCodec.Encoded> answers) {
    EncodedBatch batch = new EncodedBatch(questions, answers);
    double[] reference = LogLikelihoods.perRow(LogLikelihoods.forward(graph, batch), batch);
    InferencePass pass = InferencePass.of(graph);
    double worst = 0;
    for (int r = 0; r < questions.size(); r++) {
      double fast = pass.logLikelihood(pass.encode(questions.get(r).ids()), answers.get(r).ids());
      assertEquals(reference[r], fast, 1e-2, "row " + r);
      worst = Math.max(worst, Math.abs(reference[r] - fast));
    }
    System.out.printf("inference pass against DL4J: %d rows, max |difference| %.2e nats%n",
        questions.size(), worst);
    return worst;
  }

  private static String text(Random random, int tokens) {
    StringBuilder sb = new StringBuilder();
    for (int i = 0; i < tokens; i++) {
      sb.append('w').append(random.nextInt(3996)).append(' ');
    }
    return sb.toString();
  }
}
