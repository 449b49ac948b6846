/**
 * A stand-alone measurement of the reranker on this machine ({@link
 * org.precedent.engine.rerank.bench.RerankerBenchmark}: training throughput, scoring latency, size
 * on disk, and the share of the machine's matrix-multiply rate that scoring reaches), on synthetic
 * text. It depends on {@code rerank}, {@code rerank.net}, {@code rerank.tokens}, DL4J and ND4J; only
 * the command line's {@code benchmark reranker} calls it, and nothing in the engine depends on it.
 */
package org.precedent.engine.rerank.bench;
