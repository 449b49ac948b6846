package org.precedent.engine.rerank;

import java.time.Duration;

/**
 * Where a training run stands, reported every batch.
 *
 * @param epoch           1-based epoch being run
 * @param maxEpochs       the epoch limit (early stopping may end sooner)
 * @param batch           batches done in this epoch
 * @param batchesPerEpoch batches in an epoch
 * @param trainLoss       mean negative log-likelihood per target token over this epoch so far (nats)
 * @param validationLoss  the same on the validation split after the last finished epoch, NaN before the first
 * @param tokensPerSecond target tokens trained per second in this run
 * @param timeLeft        estimate to reach maxEpochs at the current rate: an upper bound, as early stopping may end sooner
 * @param epochEnd        this report closes an epoch (validation loss just computed)
 */
public record TrainingProgress(int epoch, int maxEpochs, int batch, int batchesPerEpoch, double trainLoss,
    double validationLoss, double tokensPerSecond, Duration timeLeft, boolean epochEnd) {}
