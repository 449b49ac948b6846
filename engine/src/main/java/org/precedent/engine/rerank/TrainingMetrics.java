package org.precedent.engine.rerank;

/**
 * What a finished training run measured; saved beside the model.
 *
 * @param trainLoss             mean negative log-likelihood per target token, last epoch (nats)
 * @param validationLoss        the best validation loss per target token, the kept model's (nats)
 * @param epochs                epochs run
 * @param trainingMillis        wall time spent training, summed over resumed runs
 * @param targetTokensPerSecond answer tokens (with end tokens) trained per second of training
 * @param antiLmLambda          the anti-LM weight chosen on the validation split
 * @param validationTop1        share of validation questions whose own answer scored best, at that weight
 * @param trainPairs            pairs trained on
 * @param validationPairs       pairs held out
 * @param vocabularySize        tokens in the vocabulary, reserved ones included
 * @param computeThreads        ND4J's thread counts during training: the same data, settings and machine
 *                              give the same weights only with the same counts
 */
public record TrainingMetrics(double trainLoss, double validationLoss, int epochs, long trainingMillis,
    double targetTokensPerSecond, double antiLmLambda, double validationTop1, int trainPairs, int validationPairs,
    int vocabularySize, ComputeThreads computeThreads) {}
