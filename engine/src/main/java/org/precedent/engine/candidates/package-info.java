/**
 * The first two stages of every decision: a {@link org.precedent.engine.candidates.CandidateSource}
 * proposes candidate answers for a cleaned question ({@link
 * org.precedent.engine.candidates.Bm25Candidates}, or {@link
 * org.precedent.engine.candidates.HybridCandidates} when the knowledge holds question vectors) and
 * a {@link org.precedent.engine.candidates.CandidateScorer} scores each (today {@link
 * org.precedent.engine.candidates.RerankerScores}), beside a {@link
 * org.precedent.engine.candidates.GroupPosterior} when the question was embedded; {@link
 * org.precedent.engine.candidates.CandidateStages} runs them. Depends on {@code knowledge.retrieve},
 * {@code knowledge.embed} and {@code engine.rerank} only; fusion, the decision and the evaluation
 * depend on it.
 */
package org.precedent.engine.candidates;
