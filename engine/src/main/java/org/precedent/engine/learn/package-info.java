/**
 * Training a team's model from its stored tickets: {@link org.precedent.engine.learn.Splits} divides
 * the tickets by a hash of their id, {@link org.precedent.engine.learn.TeamModelTrainer} trains the
 * reranker on one side and has fusion fitted on the other ({@code engine.fusion}, through the
 * candidate stages {@code engine.decide.Assembly} makes), then writes one model version and makes it
 * active. The package depends on {@code engine.decide}, {@code engine.fusion}, {@code
 * engine.rerank} with {@code rerank.train} and {@code rerank.store}, and {@code knowledge.store},
 * {@code knowledge.retrieve}, {@code knowledge.group} and {@code knowledge.ticket}; only the command
 * line and tests depend on it.
 */
package org.precedent.engine.learn;
