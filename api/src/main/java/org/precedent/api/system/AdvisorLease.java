package org.precedent.api.system;

import org.precedent.engine.decide.Advisor;

/**
 * The advisor in force when a request started, kept usable until the request closes the lease,
 * whatever swaps happen meanwhile.
 */
public final class AdvisorLease implements AutoCloseable {
  private final Served served;
  private boolean closed;

  AdvisorLease(Served served) {
    this.served = served;
  }

  public Advisor advisor() {
    return served.advisor();
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
