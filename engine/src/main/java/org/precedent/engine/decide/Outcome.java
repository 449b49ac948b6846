package org.precedent.engine.decide;

/** What Precedent does with a question. */
public enum Outcome {
  /** Reply automatically with the chosen answer group's canonical answer. */
  REPLY,
  /** Hand the conversation to a person. */
  HAND_OFF
}
