/**
 * The decision for one question: reply automatically with a past answer, or hand off to a person.
 * {@link org.precedent.engine.decide.Assembly} is the one place the stages are put together into a
 * {@link org.precedent.engine.decide.Pipeline}: candidates and their scores ({@code
 * engine.candidates}), the fused ranking and calibrated confidence ({@code engine.fusion}), the
 * {@link org.precedent.engine.decide.SafetyGate} (safety rules, people-only answers, answers still
 * holding a placeholder), then the {@link org.precedent.engine.decide.Thresholds}; the result is a
 * {@link org.precedent.engine.decide.Decision} with its explanation tree. {@link
 * org.precedent.engine.decide.InForce} opens everything in force in a data directory. The package
 * depends on {@code engine.candidates}, {@code engine.fusion}, {@code engine.explain}, {@code
 * engine.safety}, {@code engine.measure} (threshold rounding), {@code engine.rerank} (and {@code
 * rerank.store}), {@code knowledge.clean}, {@code knowledge.group}, {@code knowledge.retrieve},
 * {@code knowledge.store} and {@code knowledge.io}; training, evaluation and the service depend on
 * it, never the reverse.
 */
package org.precedent.engine.decide;
