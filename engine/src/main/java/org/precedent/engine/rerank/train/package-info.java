/**
 * Training a reranker: {@link org.precedent.engine.rerank.train.RerankerTrainer} runs Adam with
 * per-layer gradient clipping, a seeded validation split and early stopping, in the deterministic
 * epoch order of {@link org.precedent.engine.rerank.train.EpochPlan}; {@link
 * org.precedent.engine.rerank.train.Checkpoints} and {@link
 * org.precedent.engine.rerank.train.TrainingState} save a run atomically so that it resumes exactly;
 * {@link org.precedent.engine.rerank.train.LambdaTuner} chooses the anti-LM weight on validation pairs;
 * {@link org.precedent.engine.rerank.train.DataFingerprint} ties a model to its data. The package
 * depends on {@code rerank}, {@code rerank.net}, {@code rerank.tokens}, {@code knowledge.io}, DL4J and
 * ND4J; only the engine's training of a team's model ({@code engine.learn}) and tests use it.
 */
package org.precedent.engine.rerank.train;
