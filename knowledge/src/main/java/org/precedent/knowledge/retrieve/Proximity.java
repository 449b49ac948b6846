package org.precedent.knowledge.retrieve;

/**
 * How close a candidate answer's past questions are to the new question in a sentence encoder's
 * space: the dense leg's evidence beside BM25's word overlap.
 *
 * @param nearest the cosine of the group's nearest past question (exact, over all its tickets)
 * @param vote    the share of the question's nearest past tickets ({@link Retriever#NEIGHBOURS})
 *                that belong to the group
 */
public record Proximity(double nearest, double vote) {
  /** No dense leg: every candidate is as close as every other. */
  public static final Proximity NONE = new Proximity(0, 0);
}
