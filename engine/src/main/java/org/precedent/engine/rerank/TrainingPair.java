package org.precedent.engine.rerank;

import java.util.Objects;

/** One resolved exchange to learn from: what was asked and the reply that resolved it. */
public record TrainingPair(String question, String answer) {
  public TrainingPair {
    Objects.requireNonNull(question, "question");
    Objects.requireNonNull(answer, "answer");
  }
}
