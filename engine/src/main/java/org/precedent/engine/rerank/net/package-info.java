/**
 * The reranker's network and the arrays it reads and writes: {@link
 * org.precedent.engine.rerank.net.Seq2SeqReranker} builds the attentional LSTM encoder-decoder (DL4J)
 * from {@link org.precedent.engine.rerank.net.NetworkSettings}, {@link
 * org.precedent.engine.rerank.net.PairCodec} and {@link org.precedent.engine.rerank.net.EncodedBatch}
 * turn text into padded, masked id arrays, and {@link org.precedent.engine.rerank.net.LogLikelihoods}
 * reads the answer tokens' log-probabilities from the softmax output; {@link
 * org.precedent.engine.rerank.net.InferencePass} is the scoring forward pass over a trained network's
 * parameters (DL4J's function without its per-step overhead). It depends on {@code
 * rerank.tokens}, DL4J and ND4J only: not on {@code rerank} itself, which builds on it (the network is
 * handed its settings as a record of this package, so the two do not form a cycle).
 */
package org.precedent.engine.rerank.net;
