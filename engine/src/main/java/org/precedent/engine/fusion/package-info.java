/**
 * Fusion: the {@link org.precedent.engine.fusion.Features} of each scored candidate, the three
 * {@link org.precedent.engine.fusion.ScoringSystem}s (BM25 alone, reranker alone, fused), the
 * {@link org.precedent.engine.fusion.Ranker} that orders candidates by one of them and gives its
 * Platt-calibrated confidence (and explains it), the fitted {@link
 * org.precedent.engine.fusion.FusionModel} kept as {@code fusion.json}, and its fitting on the
 * fusion split ({@link org.precedent.engine.fusion.FusionFit}, {@link
 * org.precedent.engine.fusion.SystemFit}). Depends on {@code engine.candidates}, {@code
 * engine.stats}, {@code engine.measure}, {@code engine.explain}, {@code engine.rerank}, {@code
 * knowledge.retrieve}, {@code knowledge.io} and Jackson.
 */
package org.precedent.engine.fusion;
