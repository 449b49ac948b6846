package org.precedent.engine.measure;

/**
 * One proposed answer as the measures see it, judged: the confidence Precedent gave it and whether
 * it was right (not to be confused with the reranker's {@code AnswerScore}, a score before any
 * judgement).
 *
 * <p>An answer given to a ticket that was out of scope is a wrong answer: the caller passes
 * {@code correct = false} for it, so that every measure here counts it against the system.
 *
 * @param confidence the confidence in [0, 1]; NaN and values outside the range are rejected because
 *                   every measure here (bins, thresholds, bounds) assumes a probability
 * @param correct    whether the proposed answer was the right one
 */
public record JudgedAnswer(double confidence, boolean correct) {
  public JudgedAnswer {
    if (Double.isNaN(confidence)) {
      throw new IllegalArgumentException("confidence is NaN; a judged answer needs a confidence in [0, 1]");
    }
    if (confidence < 0.0 || confidence > 1.0) {
      throw new IllegalArgumentException("confidence " + confidence + " is outside [0, 1]");
    }
  }
}
