package org.precedent.engine.rerank;

/**
 * How well one candidate answer fits a question, by the reranker.
 *
 * @param logLikelihood         log P(answer | question): natural-log probabilities of the answer's tokens
 *                              and its end token, summed
 * @param tokens                tokens scored (answer tokens kept plus the end token)
 * @param perTokenLogLikelihood logLikelihood / tokens, comparable across answers of different length
 * @param antiLm                log P(answer | question) - lambda * log P(answer): penalises answers that are
 *                              likely whatever the question (Li et al. 2016, anti-LM objective)
 * @param questionTruncated     the question was longer than the model keeps and was cut
 * @param answerTruncated       this answer was longer than the model keeps and was cut
 */
public record AnswerScore(double logLikelihood, int tokens, double perTokenLogLikelihood, double antiLm,
    boolean questionTruncated, boolean answerTruncated) {}
