/**
 * The first two stages of every decision: a {@link org.precedent.engine.candidates.CandidateSource}
 * proposes candidate answers for a cleaned question (today {@link
 * org.precedent.engine.candidates.Bm25Candidates}) and a {@link
 * org.precedent.engine.candidates.CandidateScorer} scores each (today {@link
 * org.precedent.engine.candidates.RerankerScores}); {@link
 * org.precedent.engine.candidates.CandidateStages} runs the two. Depends on {@code
 * knowledge.retrieve} and {@code engine.rerank} only; fusion, the decision and the evaluation
 * depend on it.
 */
package org.precedent.engine.candidates;
