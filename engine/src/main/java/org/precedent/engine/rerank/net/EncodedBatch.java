package org.precedent.engine.rerank.net;

import java.util.List;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.dataset.MultiDataSet;
import org.nd4j.linalg.factory.Nd4j;
import org.precedent.engine.rerank.tokens.Vocabulary;

/**
 * A batch of (question, answer) rows as network arrays, padded to the longest row with masks.
 *
 * <p>Shapes follow DL4J's recurrent layout [batch, features, time]: ids as [B, 1, T], masks [B, T] with 1
 * on real steps. Decoder input row i is {@code <s> a1 .. an}; its targets are {@code a1 .. an </s>}; both
 * share the answer mask. Padding ids are 0 ({@code <pad>}) and masked out everywhere.
 */
public final class EncodedBatch {

  private final int rows;
  private final int questionSteps;
  private final int answerSteps;
  private final float[] question;
  private final float[] questionMask;
  private final float[] answerIn;
  private final float[] answerMask;
  private final float[] targets;
  private final int[] targetCounts;

  public EncodedBatch(List<PairCodec.Encoded> questions, List<PairCodec.Encoded> answers) {
    if (questions.size() != answers.size() || questions.isEmpty()) {
      throw new IllegalArgumentException("need as many questions as answers, and at least one");
    }
    rows = questions.size();
    questionSteps = questions.stream().mapToInt(PairCodec.Encoded::length).max().orElseThrow();
    answerSteps = answers.stream().mapToInt(PairCodec.Encoded::length).max().orElseThrow() + 1;
    question = new float[rows * questionSteps];
    questionMask = new float[rows * questionSteps];
    answerIn = new float[rows * answerSteps];
    answerMask = new float[rows * answerSteps];
    targets = new float[rows * answerSteps];
    targetCounts = new int[rows];
    for (int r = 0; r < rows; r++) {
      PairCodec.Encoded q = questions.get(r);
      for (int t = 0; t < q.length(); t++) {
        question[r * questionSteps + t] = q.id(t);
        questionMask[r * questionSteps + t] = 1f;
      }
      PairCodec.Encoded a = answers.get(r);
      int n = a.length();
      for (int t = 0; t <= n; t++) {
        answerIn[r * answerSteps + t] = t == 0 ? Vocabulary.START_ID : a.id(t - 1);
        targets[r * answerSteps + t] = t == n ? Vocabulary.END_ID : a.id(t);
        answerMask[r * answerSteps + t] = 1f;
      }
      targetCounts[r] = n + 1;
    }
  }

  public int rows() {
    return rows;
  }

  /** Target tokens of all rows together: the unit of training throughput. */
  public long targetTokens() {
    long sum = 0;
    for (int c : targetCounts) {
      sum += c;
    }
    return sum;
  }

  public int targetCount(int row) {
    return targetCounts[row];
  }

  public int target(int row, int step) {
    return (int) targets[row * answerSteps + step];
  }

  public INDArray[] inputs() {
    return new INDArray[] {ids(question, questionSteps), ids(answerIn, answerSteps)};
  }

  public INDArray[] inputMasks() {
    return new INDArray[] {mask(questionMask, questionSteps), mask(answerMask, answerSteps)};
  }

  /** Features, masks and sparse (index) labels for one training step. */
  public MultiDataSet toDataSet() {
    INDArray answerMaskArray = mask(answerMask, answerSteps);
    return new MultiDataSet(inputs(), new INDArray[] {ids(targets, answerSteps)},
        new INDArray[] {mask(questionMask, questionSteps), answerMaskArray}, new INDArray[] {answerMaskArray});
  }

  private INDArray ids(float[] data, int steps) {
    return Nd4j.create(data, new long[] {rows, 1, steps}, 'c');
  }

  private INDArray mask(float[] data, int steps) {
    return Nd4j.create(data, new long[] {rows, steps}, 'c');
  }
}
