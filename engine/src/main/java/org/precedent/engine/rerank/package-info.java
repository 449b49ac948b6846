/**
 * The reranker as the rest of the engine sees it: a trained {@link
 * org.precedent.engine.rerank.RerankerModel} (network, vocabulary, {@link
 * org.precedent.engine.rerank.RerankerConfig} and anti-LM weight), the {@link
 * org.precedent.engine.rerank.Scorer} that gives each candidate answer log P(answer | question) in one
 * batched pass, and the records of training ({@link org.precedent.engine.rerank.TrainingPair}, {@link
 * org.precedent.engine.rerank.TrainingMetrics}, {@link org.precedent.engine.rerank.TrainedReranker}).
 * Its sub-packages hold the parts: {@code tokens}, {@code net} (the network), {@code train}, {@code
 * store} (model versions on disk) and {@code bench}. This package may depend on {@code rerank.net} and
 * {@code rerank.tokens}, on DL4J and ND4J, and on Jackson (the {@code .properties} files of {@link
 * org.precedent.engine.rerank.PropertiesRecords}); {@code train}, {@code store} and {@code bench}
 * depend on it, never the reverse, and it knows nothing of tickets, fusion or decisions.
 */
package org.precedent.engine.rerank;
