package org.precedent.engine.rerank.train;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.engine.rerank.TrainingPair;

/**
 * The deterministic parts of a run: which pairs are held out, and each epoch's order of rows.
 *
 * <p>An epoch's order depends only on the seed and the epoch number, never on earlier random draws, so a
 * run resumed from a checkpoint replays exactly the batches the interrupted run would have seen.
 * Row {@code i >= 0} is training pair i; row {@code -(i + 1)} is pair i with its question emptied (the
 * share of such rows is {@link RerankerConfig#unconditionalShare()}).
 */
final class EpochPlan {

  record Split(List<TrainingPair> train, List<TrainingPair> validation) {}

  private final int trainCount;
  private final int unconditionalCount;
  private final int batchSize;
  private final long seed;
  private int cachedEpoch = -1;
  private int[] cachedOrder;

  EpochPlan(int trainCount, RerankerConfig config) {
    this.trainCount = trainCount;
    this.unconditionalCount = (int) Math.round(trainCount * config.unconditionalShare());
    this.batchSize = config.batchSize();
    this.seed = config.seed();
  }

  /** Holds out {@code validationShare} of the pairs (at least one), chosen with the seed. */
  static Split split(List<TrainingPair> pairs, RerankerConfig config) {
    if (pairs.size() < 2) {
      throw new IllegalArgumentException("training needs at least 2 pairs, got " + pairs.size());
    }
    List<Integer> order = new ArrayList<>();
    for (int i = 0; i < pairs.size(); i++) {
      order.add(i);
    }
    Collections.shuffle(order, new Random(config.seed()));
    int held = Math.max(1, (int) Math.round(pairs.size() * config.validationShare()));
    List<TrainingPair> validation = new ArrayList<>();
    List<TrainingPair> train = new ArrayList<>();
    for (int k = 0; k < order.size(); k++) {
      (k < held ? validation : train).add(pairs.get(order.get(k)));
    }
    return new Split(List.copyOf(train), List.copyOf(validation));
  }

  int batchesPerEpoch() {
    return (trainCount + unconditionalCount + batchSize - 1) / batchSize;
  }

  /** Rows of batch {@code batch} of epoch {@code epoch}. */
  int[] batch(int epoch, int batch) {
    int[] order = order(epoch);
    int from = batch * batchSize;
    int to = Math.min(order.length, from + batchSize);
    int[] rows = new int[to - from];
    System.arraycopy(order, from, rows, 0, rows.length);
    return rows;
  }

  private int[] order(int epoch) {
    if (epoch != cachedEpoch) {
      cachedOrder = computeOrder(epoch);
      cachedEpoch = epoch;
    }
    return cachedOrder;
  }

  private int[] computeOrder(int epoch) {
    Random random = new Random(seed * 1_000_003L + epoch);
    List<Integer> rows = new ArrayList<>(trainCount + unconditionalCount);
    for (int i = 0; i < trainCount; i++) {
      rows.add(i);
    }
    List<Integer> emptied = new ArrayList<>(rows);
    Collections.shuffle(emptied, random);
    for (int i = 0; i < unconditionalCount; i++) {
      rows.add(-(emptied.get(i) + 1));
    }
    Collections.shuffle(rows, random);
    return rows.stream().mapToInt(Integer::intValue).toArray();
  }
}
