package org.precedent.engine.fusion;

import java.util.List;

/**
 * The three ways Precedent can rank candidate answers, kept side by side so that evaluation can
 * show what each part adds.
 */
public enum ScoringSystem {
  /** BM25 order; confidence from BM25 features only. */
  BM25(Features.BM25),
  /** The reranker's anti-LM order; confidence from reranker features only. */
  RERANKER(Features.RERANKER),
  /** Order and confidence from a logistic combination of all features. */
  FUSED(Features.ALL);

  private final List<String> features;

  ScoringSystem(List<String> features) {
    this.features = features;
  }

  public List<String> features() {
    return features;
  }

  /** A lower-case name for reports. */
  public String label() {
    return switch (this) {
      case BM25 -> "BM25 alone";
      case RERANKER -> "reranker alone";
      case FUSED -> "fused";
    };
  }
}
