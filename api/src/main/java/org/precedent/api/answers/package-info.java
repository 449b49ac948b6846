/**
 * The answer library: one stored answer per answer group in the service's database ({@link
 * org.precedent.api.answers.AnswerLibrary}, migration {@code V3__answer_library.sql}), drafted by
 * grouping and approved, edited or retired by managers, every change versioned and audited; synced
 * with each new knowledge generation, keeping what people decided. {@link
 * org.precedent.api.answers.AnswerGate} lets the queue reply only with approved answers, in their
 * approved text; {@link org.precedent.api.answers.AnswersController} serves {@code
 * /api/v1/answers}; {@link org.precedent.api.answers.ApprovalCoverage} counts a held-out
 * evaluation with and without that gate. It depends on {@code engine.evaluate} (the held-out
 * outcomes), {@code api.decision} (the decision view), {@code api.system},
 * {@code engine.decide} (hand-off reasons), {@code engine.explain}, {@code knowledge.clean}
 * (placeholders), {@code knowledge.group}, {@code knowledge.store}, Spring Web, Spring JDBC and
 * Spring's transactions; {@code api.queue}, {@code api.threshold} and the command line depend on
 * it.
 */
package org.precedent.api.answers;
