/**
 * The decision for one question: reply automatically with a past answer, or hand off to a person.
 * {@link org.precedent.engine.decide.Advisor} runs it: BM25 candidates and the reranker's scores
 * ({@link org.precedent.engine.decide.CandidateScoring}), {@link org.precedent.engine.decide.Features},
 * the fused ranking and Platt-calibrated confidence of each {@link
 * org.precedent.engine.decide.ScoringSystem} ({@link org.precedent.engine.decide.Ranker}, {@link
 * org.precedent.engine.decide.FusionModel}, kept as {@code fusion.json}), the {@link
 * org.precedent.engine.decide.SafetyGate}, then the {@link org.precedent.engine.decide.Thresholds};
 * the result is a {@link org.precedent.engine.decide.Decision}. {@link
 * org.precedent.engine.decide.ActiveModel} opens everything in force in a data directory. The package
 * depends on {@code knowledge.clean}, {@code knowledge.group}, {@code knowledge.retrieve}, {@code
 * knowledge.store}, {@code knowledge.io}, {@code engine.rerank} (and {@code rerank.store}), {@code
 * engine.safety}, {@code engine.stats}, {@code engine.measure} (threshold rounding) and Jackson;
 * training ({@code engine.learn}), evaluation and the service depend on it, never the reverse.
 */
package org.precedent.engine.decide;
