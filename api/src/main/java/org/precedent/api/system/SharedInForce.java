package org.precedent.api.system;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.concurrent.atomic.AtomicInteger;
import org.precedent.engine.decide.InForce;

/**
 * An opened model version with a count of its users. The holder that serves it counts as one user;
 * each request in flight counts as one more. The files are closed when the last user lets go, so a
 * swap never pulls the knowledge out from under a request that is still deciding.
 */
final class SharedInForce {
  private final InForce model;
  private final AtomicInteger users = new AtomicInteger(1);

  SharedInForce(InForce model) {
    this.model = model;
  }

  InForce model() {
    return model;
  }

  /** Takes a use, unless the model was already closed (then the caller reads the new one). */
  boolean tryRetain() {
    while (true) {
      int n = users.get();
      if (n == 0) {
        return false;
      }
      if (users.compareAndSet(n, n + 1)) {
        return true;
      }
    }
  }

  void release() {
    if (users.decrementAndGet() == 0) {
      try {
        model.close();
      } catch (IOException e) {
        throw new UncheckedIOException("closing model " + model.version(), e);
      }
    }
  }

  int users() {
    return users.get();
  }
}
