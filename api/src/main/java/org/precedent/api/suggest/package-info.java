/**
 * Suggestions and decisions over HTTP: {@link org.precedent.api.suggest.SuggestController} serves
 * {@code /api/v1/suggestions} (ranked answers for agents) and {@code /api/v1/decisions} (reply or hand
 * off), both decided by {@link org.precedent.api.decision.Decider} on the model in force and within the
 * decision slots; {@link org.precedent.api.suggest.FeedbackController} records what agents did with a
 * suggestion ({@code /api/v1/feedback}). Decisions are shown as {@link
 * org.precedent.api.decision.DecisionView}. It depends on {@code api.decision}, {@code api.system},
 * {@code knowledge.clean}, {@code knowledge.ticket}, Spring Web and Spring JDBC; nothing depends on it.
 */
package org.precedent.api.suggest;
