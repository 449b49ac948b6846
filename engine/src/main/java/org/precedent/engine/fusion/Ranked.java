package org.precedent.engine.fusion;

import java.util.List;

/**
 * Candidates in one system's order, with the system's confidence that the first is right.
 *
 * @param system     the system that ordered them
 * @param candidates best first
 * @param confidence calibrated P(first candidate is the right answer); 0 when there is none
 */
public record Ranked(ScoringSystem system, List<ScoredCandidate> candidates, double confidence) {
  public Ranked {
    candidates = List.copyOf(candidates);
  }
}
