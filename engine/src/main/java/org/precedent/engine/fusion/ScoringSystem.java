package org.precedent.engine.fusion;

import java.util.ArrayList;
import java.util.List;

/**
 * The ways Precedent can rank candidate answers, kept side by side so that evaluation can show
 * what each part adds. The dense systems exist only in a model trained on knowledge with question
 * vectors; fusion then also learns from the dense leg's features.
 */
public enum ScoringSystem {
  /** BM25 order; confidence from BM25 features only. */
  BM25,
  /** The dense leg alone: order and confidence from its features (nearest cosine, vote, classifier). */
  DENSE,
  /** The reranker's anti-LM order; confidence from reranker features only. */
  RERANKER,
  /** Order and confidence from a logistic combination of every feature but the reranker's. */
  FUSED_WITHOUT_RERANKER,
  /** Order and confidence from a logistic combination of all features. */
  FUSED,
  /**
   * Fused without the reranker where BM25, the dense leg and their fusion put the same answer
   * first, fused with it elsewhere: the reranker runs only where the faster legs disagree. Not a
   * fitted model of its own but a rule over two fitted ones, so it needs a dense leg.
   */
  CASCADE;

  /** Systems every model has, dense leg or not. */
  static final List<ScoringSystem> ALWAYS = List.of(BM25, RERANKER, FUSED);

  /**
   * Feature names the system uses.
   *
   * @param dense whether the model has a dense leg
   */
  public List<String> features(boolean dense) {
    List<String> out = new ArrayList<>();
    switch (this) {
      case BM25 -> out.addAll(Features.BM25);
      case DENSE -> out.addAll(Features.DENSE);
      case RERANKER -> out.addAll(Features.RERANKER);
      case FUSED_WITHOUT_RERANKER -> {
        out.addAll(Features.BM25);
        if (dense) {
          out.addAll(Features.DENSE);
        }
      }
      case FUSED, CASCADE -> {
        out.addAll(Features.BM25);
        out.addAll(Features.RERANKER);
        if (dense) {
          out.addAll(Features.DENSE);
        }
      }
    }
    return List.copyOf(out);
  }

  /** Whether a model with or without a dense leg has this system. */
  public boolean applies(boolean dense) {
    return (this != DENSE && this != CASCADE) || dense;
  }

  /** Whether fusion fits a logistic model for the system (all but the cascade, a rule over two). */
  public boolean fitted() {
    return this != CASCADE;
  }

  /** Whether ranking by the system may need the reranker's scores. */
  public boolean usesReranker() {
    return this == RERANKER || this == FUSED || this == CASCADE;
  }

  /** A lower-case name for reports. */
  public String label() {
    return switch (this) {
      case BM25 -> "BM25 alone";
      case DENSE -> "dense alone";
      case RERANKER -> "reranker alone";
      case FUSED_WITHOUT_RERANKER -> "fused without reranker";
      case FUSED -> "fused";
      case CASCADE -> "fused, reranker where legs disagree";
    };
  }
}
