package org.precedent.api.system;

import org.precedent.engine.decide.Pipeline;

/**
 * The pipeline in force when a request started, kept usable until the request closes the lease,
 * whatever swaps happen meanwhile.
 */
public final class PipelineLease implements AutoCloseable {
  private final Served served;
  private boolean closed;

  PipelineLease(Served served) {
    this.served = served;
  }

  public Pipeline pipeline() {
    return served.pipeline();
  }

  public String version() {
    return served.loaded().model().version();
  }

  @Override
  public void close() {
    if (!closed) {
      closed = true;
      served.loaded().release();
    }
  }
}
