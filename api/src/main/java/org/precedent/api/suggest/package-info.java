/**
 * Suggestions and decisions over HTTP: {@link org.precedent.api.suggest.SuggestController} serves
 * {@code /api/v1/suggestions} (ranked answers for agents) and {@code /api/v1/decisions} (reply or hand
 * off), both decided by {@link org.precedent.api.suggest.Decider} on the model in force and within the
 * decision slots; {@link org.precedent.api.suggest.FeedbackController} records what agents did with a
 * suggestion ({@code /api/v1/feedback}). Decisions are shown as view records ({@link
 * org.precedent.api.suggest.DecisionView} and its parts). It depends on {@code api.system}, {@code
 * engine.decide}, {@code knowledge.clean}, {@code knowledge.retrieve} (evidence records), Spring Web,
 * Spring JDBC and Micrometer; {@code api.queue} uses its {@code Decider} and views.
 */
package org.precedent.api.suggest;
