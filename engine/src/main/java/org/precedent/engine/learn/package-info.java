/**
 * Training a team's model from its stored tickets: {@link org.precedent.engine.learn.Splits} divides
 * the tickets by a hash of their id, {@link org.precedent.engine.learn.TeamModelTrainer} trains the
 * reranker on one side and {@link org.precedent.engine.learn.FusionFit} fits fusion and calibration on
 * the other (each question asked with itself left out of retrieval; {@link
 * org.precedent.engine.learn.SystemFit} fits one scoring system, with out-of-fold Platt scaling), then
 * writes one model version and makes it active. The package depends on {@code engine.decide} (the
 * fitted parts it produces), {@code engine.rerank} with {@code rerank.train} and {@code rerank.store},
 * {@code engine.stats}, {@code engine.measure}, and {@code knowledge.store}, {@code
 * knowledge.retrieve}, {@code knowledge.group}, {@code knowledge.ticket} and {@code knowledge.io};
 * only the command line and tests depend on it.
 */
package org.precedent.engine.learn;
