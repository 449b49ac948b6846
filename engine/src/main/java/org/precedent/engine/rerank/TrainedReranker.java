package org.precedent.engine.rerank;

/**
 * The outcome of a training run.
 *
 * @param model           the model with the best validation loss, anti-LM weight set
 * @param metrics         what the run measured
 * @param dataFingerprint SHA-256 of the training pairs, to tell later which data a model came from
 */
public record TrainedReranker(RerankerModel model, TrainingMetrics metrics, String dataFingerprint) {}
