package org.precedent.api.queue;

import io.micrometer.core.instrument.Gauge;
import io.micrometer.core.instrument.MeterRegistry;
import java.util.List;
import java.util.concurrent.Semaphore;
import java.util.concurrent.TimeUnit;
import org.precedent.api.suggest.Decider;
import org.precedent.api.suggest.DecisionView;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.context.SmartLifecycle;
import org.springframework.stereotype.Component;

/**
 * Decides queued tickets one at a time on a thread of its own. It wakes when a ticket is submitted,
 * and every poll interval in any case (a ticket stored by another instance, or left by a crash).
 */
@Component
class QueueWorker implements SmartLifecycle {
  private static final Logger LOG = LoggerFactory.getLogger(QueueWorker.class);
  private final TicketQueue queue;
  private final Decider decider;
  private final long pollMs;
  private final Semaphore wake = new Semaphore(0);
  private volatile boolean running;
  private Thread thread;

  QueueWorker(TicketQueue queue, Decider decider, MeterRegistry meters,
      @Value("${precedent.queue.poll-ms}") long pollMs) {
    this.queue = queue;
    this.decider = decider;
    this.pollMs = pollMs;
    Gauge.builder("precedent.queue.pending", () -> queue.count("PENDING")).register(meters);
  }

  void wake() {
    wake.release();
  }

  @Override
  public void start() {
    int released = queue.releaseClaims();
    if (released > 0) {
      LOG.info("{} tickets were being decided when the service last stopped; deciding them now",
          released);
    }
    running = true;
    thread = new Thread(this::run, "precedent-queue");
    thread.start();
  }

  private void run() {
    while (running) {
      try {
        List<TicketQueue.Claimed> claimed = queue.claim(16);
        for (TicketQueue.Claimed c : claimed) {
          decide(c);
        }
        if (claimed.isEmpty()) {
          wake.tryAcquire(pollMs, TimeUnit.MILLISECONDS);
          wake.drainPermits();
        }
      } catch (InterruptedException e) {
        return;
      } catch (RuntimeException e) {
        // The database may be briefly unavailable; claims stay and are retried.
        LOG.warn("queue worker: {}", e.toString());
        sleepQuietly();
      }
    }
  }

  private void decide(TicketQueue.Claimed c) {
    DecisionView d;
    try {
      d = decider.decide(c.question(), c.category(), 3, "queue");
    } catch (RuntimeException e) {
      LOG.warn("ticket {}: decision failed (try {} of {}): {}", c.ticketId(), c.attempt(),
          TicketQueue.MAX_ATTEMPTS, e.toString());
      queue.failed(c);
      return;
    }
    queue.decided(c, d);
  }

  private void sleepQuietly() {
    try {
      Thread.sleep(pollMs);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      running = false;
    }
  }

  @Override
  public void stop() {
    running = false;
    wake.release();
    if (thread != null) {
      try {
        // A decision in progress finishes and is stored; after that the thread ends.
        thread.join(30_000);
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      }
    }
  }

  @Override
  public boolean isRunning() {
    return running;
  }
}
