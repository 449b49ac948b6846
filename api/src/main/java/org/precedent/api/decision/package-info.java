/**
 * A decision as the service and the command line show it: {@link org.precedent.api.decision.Decider}
 * decides a question on the model in force (raw, or already cleaned as the queue stores it) and
 * counts the outcome, and {@link org.precedent.api.decision.DecisionView} with its candidates and
 * evidence is the one mapping of an engine decision to what callers see (JSON in the service, JSON
 * Lines in triage, text in {@code ask}). It depends on {@code api.system} (the lease on the
 * pipeline in force), {@code engine.decide}, {@code engine.explain}, {@code engine.fusion}, {@code
 * knowledge.retrieve} (evidence records) and Micrometer; {@code api.suggest}, {@code api.queue},
 * {@code api.triage} and {@code api.cli} use it.
 */
package org.precedent.api.decision;
