package org.precedent.engine.decide;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.function.Supplier;
import org.precedent.engine.rerank.Scorer;

/**
 * The reranker, loaded at once or when first asked for; once loaded, every caller shares it.
 * Loading once under a lock keeps two first decisions from reading the network twice.
 */
final class DeferredScorer implements Supplier<Scorer> {
  /** Loads the reranker; may fail as reading a model version does. */
  interface Loader {
    Scorer load() throws IOException;
  }

  private final Loader loader;
  private volatile Scorer scorer;
  private long loadNanos;

  DeferredScorer(Loader loader) {
    this.loader = loader;
  }

  DeferredScorer(Scorer loaded, long loadNanos) {
    this.loader = null;
    this.scorer = loaded;
    this.loadNanos = loadNanos;
  }

  @Override
  public Scorer get() {
    Scorer s = scorer;
    if (s != null) {
      return s;
    }
    synchronized (this) {
      if (scorer == null) {
        long t0 = System.nanoTime();
        try {
          scorer = loader.load();
        } catch (IOException e) {
          throw new UncheckedIOException(e.getMessage(), e);
        }
        loadNanos = System.nanoTime() - t0;
      }
      return scorer;
    }
  }

  boolean loaded() {
    return scorer != null;
  }

  synchronized long loadNanos() {
    return loadNanos;
  }
}
