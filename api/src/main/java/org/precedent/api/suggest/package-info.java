/**
 * Suggestions and decisions over HTTP: {@link org.precedent.api.suggest.SuggestController} serves
 * {@code /api/v1/suggestions} (ranked answers for agents) and {@code /api/v1/decisions} (reply or hand
 * off), both decided by {@link org.precedent.api.decision.Decider} on the model in force and within the
 * decision slots; {@link org.precedent.api.suggest.FeedbackController} records what agents did with a
 * suggestion ({@code /api/v1/feedback}: the verdict, the suggestion's text as shown, the text sent,
 * and whether it is proposed as the answer's next version), and {@link
 * org.precedent.api.suggest.FeedbackTraining} turns what agents accepted or edited into training
 * pairs for {@code train}. Decisions are shown as {@link org.precedent.api.decision.DecisionView}.
 * It depends on {@code api.decision}, {@code api.system}, {@code engine.rerank} (training pairs),
 * {@code knowledge.clean}, {@code knowledge.group}, {@code knowledge.store}, {@code
 * knowledge.ticket}, Spring Web and Spring JDBC; {@code api.cli} depends on it (train).
 */
package org.precedent.api.suggest;
