/**
 * Saved model versions: {@link org.precedent.engine.rerank.store.ModelStore} writes a trained
 * reranker (and whatever else the caller adds to the version, such as {@code fusion.json}) into a
 * hidden directory renamed into place as {@code v-NNNN}, with a SHA-256 manifest of every file,
 * verifies the manifest on load and on activation, and switches the {@code ACTIVE} file atomically.
 * It depends on {@code rerank}, {@code rerank.tokens}, {@code knowledge.io}, DL4J (weights) and
 * Jackson ({@code metrics.json}); the decision, training, the service and the command line depend
 * on it.
 */
package org.precedent.engine.rerank.store;
