package org.precedent.api.queue;

import io.micrometer.core.instrument.Gauge;
import io.micrometer.core.instrument.MeterRegistry;
import java.time.Duration;
import java.util.ArrayDeque;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Semaphore;
import java.util.concurrent.TimeUnit;
import org.precedent.api.answers.AnswerGate;
import org.precedent.api.decision.Decider;
import org.precedent.api.decision.DecisionView;
import org.precedent.api.system.StorageFailures;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.context.SmartLifecycle;
import org.springframework.stereotype.Component;

/**
 * Decides queued tickets one at a time on a thread of its own, claiming {@code precedent.queue.batch}
 * at once. It wakes when a ticket is submitted, and every poll interval in any case (a ticket
 * stored by another replica, or a claim whose replica stopped). A decision the queue refuses
 * (the claim's lease ended and another replica took the ticket) is logged and dropped; a stopping
 * worker gives its undecided claims back.
 *
 * <p>Whatever one ticket's decision throws (a {@link StackOverflowError} included) is that
 * ticket's failure: it is recorded with the ticket and the worker goes on with the next. When the
 * database itself fails (it stopped, or cannot write), that is nobody's ticket's fault and costs
 * no try: the worker keeps the decision it could not store, or the claim it could not decide (the
 * answer library is read from the database), waits, doubling the wait up to 5 s, and stores or
 * decides it once the database works again, so it recovers without a restart. A decision kept
 * over a long outage is still stored only if the claim is still this replica's.
 */
@Component
class QueueWorker implements SmartLifecycle {
  private static final Logger LOG = LoggerFactory.getLogger(QueueWorker.class);
  private static final long MAX_PAUSE_MS = 5_000;
  private static final Duration LEASE_MARGIN = Duration.ofSeconds(2);
  private final TicketQueue queue;
  private final Decider decider;
  private final AnswerGate answers;
  private final long pollMs;
  private final int batch;
  // Claimed and not yet decided: the worker's own thread alone touches it.
  private final ArrayDeque<TicketQueue.Claimed> claimed = new ArrayDeque<>();
  private final Semaphore wake = new Semaphore(0);
  // Claims whose failure could not be stored yet (the database failed), by ticket id: the
  // worker's own thread alone touches it.
  private final Map<String, Unfinished> unfinished = new LinkedHashMap<>();
  // A decision made whose storing failed because the database did: the worker's thread alone.
  private Outcome pending;
  private volatile boolean running;
  private volatile Thread thread;

  private record Unfinished(TicketQueue.Claimed claim, String reason) {}

  private record Outcome(TicketQueue.Claimed claim, DecisionView decision) {}

  QueueWorker(TicketQueue queue, Decider decider, AnswerGate answers,
      MeterRegistry meters,
      @Value("${precedent.queue.poll-ms}") long pollMs,
      @Value("${precedent.queue.batch:8}") int batch) {
    if (batch < 1) {
      throw new IllegalArgumentException("precedent.queue.batch must be at least 1, not " + batch);
    }
    this.queue = queue;
    this.decider = decider;
    this.answers = answers;
    this.pollMs = pollMs;
    this.batch = batch;
    for (TicketState state : TicketState.values()) {
      Gauge.builder("precedent.queue.tickets", () -> queue.count(state))
          .description("tickets in the queue's database, by state")
          .tag("state", state.name().toLowerCase(Locale.ROOT)).register(meters);
    }
  }

  void wake() {
    wake.release();
  }

  @Override
  public void start() {
    TicketQueue.Released released = queue.releaseClaims();
    if (released.queued() > 0) {
      LOG.info("{} tickets were being decided when the service last stopped; deciding them now",
          released.queued());
    }
    if (released.failed() > 0) {
      LOG.warn("{} tickets were being decided when the service stopped on their last try; "
          + "marked failed, a person must take them", released.failed());
    }
    running = true;
    Thread t = new Thread(this::run, "precedent-queue");
    thread = t;
    t.start();
  }

  private void run() {
    boolean failing = false;
    long pause = pollMs;
    long failingSince = 0;
    int tries = 0;
    while (running) {
      try {
        storePending();
        storeUnfinished();
        if (claimed.isEmpty()) {
          claimed.addAll(queue.claimBatch(batch));
        }
        if (failing) {
          LOG.info("queue worker: the database works again after {} ms and {} tries; going on "
              + "with {} claimed tickets", (System.nanoTime() - failingSince) / 1_000_000, tries,
              claimed.size());
          failing = false;
          pause = pollMs;
        }
        TicketQueue.Claimed next = claimed.poll();
        if (next != null) {
          // A claim whose lease is about to end is another replica's to take: deciding it now
          // would most likely be refused.
          if (next.leaseLeft(LEASE_MARGIN)) {
            decide(next);
          } else {
            queue.giveBack(next);
          }
        } else {
          wake.tryAcquire(pollMs, TimeUnit.MILLISECONDS);
          wake.drainPermits();
        }
      } catch (InterruptedException e) {
        break;
      } catch (Throwable e) {
        // The database is unavailable (or worse); claims and unstored outcomes stay and are
        // retried after a pause. The thread must not end here: nothing else would decide tickets.
        if (!failing) {
          LOG.warn("queue worker: {}; trying again in {} ms, then less and less often (at "
              + "least every {} ms)", StorageFailures.isStorageFailure(e) ? "storage failed: "
                  + StorageFailures.describe(e) : e.toString(), pause,
              Math.max(pollMs, MAX_PAUSE_MS));
          failing = true;
          failingSince = System.nanoTime();
          tries = 0;
        }
        tries++;
        sleepQuietly(pause);
        // Each try while storage fails opens the database anew; a few a minute are enough.
        pause = Math.min(2 * pause, Math.max(pollMs, MAX_PAUSE_MS));
      }
    }
    giveBackClaims();
  }

  /** On stopping: the batch's undecided claims go back to the queue for any replica at once. */
  private void giveBackClaims() {
    try {
      for (TicketQueue.Claimed c : claimed) {
        queue.giveBack(c);
      }
    } catch (RuntimeException e) {
      LOG.warn("queue worker: {} claims could not be given back ({}); they return when their "
          + "lease ends", claimed.size(), describe(e));
    }
    claimed.clear();
  }

  private void decide(TicketQueue.Claimed c) {
    DecisionView d;
    try {
      // The library has the last word on what the queue sends (approved answers only).
      d = answers.apply(decider.decideCleaned(c.question(), c.category(), c.fields(), 3,
          "queue"), c.fields());
    } catch (RuntimeException | Error e) {
      if (StorageFailures.isStorageFailure(e)) {
        // The database failed, not the ticket: decided again, on the same claim and try, once
        // it works.
        claimed.addFirst(c);
        throw e;
      }
      String reason = describe(e);
      LOG.warn("ticket {}: decision failed (try {} of {}): {}", c.ticketId(), c.attempt(),
          TicketQueue.MAX_ATTEMPTS, reason);
      fail(c, reason);
      return;
    }
    pending = new Outcome(c, d);
    storePending();
  }

  /**
   * Stores the decision made last, if it is not stored yet. When the database fails this throws
   * and the decision stays, to be stored on the next try; any other failure to store it is the
   * ticket's failed try.
   */
  private void storePending() {
    Outcome o = pending;
    if (o == null) {
      return;
    }
    TicketQueue.Claimed c = o.claim();
    boolean stored;
    try {
      stored = queue.decided(c, o.decision());
    } catch (RuntimeException e) {
      if (StorageFailures.isStorageFailure(e)) {
        throw e;
      }
      pending = null;
      String reason = "its decision could not be stored: " + describe(e);
      LOG.warn("ticket {}: {} (try {} of {})", c.ticketId(), reason, c.attempt(),
          TicketQueue.MAX_ATTEMPTS);
      fail(c, reason);
      return;
    }
    pending = null;
    if (!stored) {
      // Also when the database committed the decision and failed before saying so: the ticket is
      // then decided already, and this refusal keeps it decided once.
      LOG.warn("ticket {}: decision refused, the claim (replica {}, try {}) is no longer this "
          + "replica's: its lease ended and another replica claimed it, or it is decided",
          c.ticketId(), queue.owner(), c.attempt());
    }
  }

  /** Records a failed try, or keeps it to record once the database works again. */
  private void fail(TicketQueue.Claimed c, String reason) {
    unfinished.put(c.ticketId(), new Unfinished(c, reason));
    storeUnfinished();
  }

  private void storeUnfinished() {
    var it = unfinished.values().iterator();
    while (it.hasNext()) {
      Unfinished u = it.next();
      if (!queue.failed(u.claim(), u.reason())) {
        LOG.warn("ticket {}: failure not recorded, the claim is no longer this replica's",
            u.claim().ticketId());
      }
      it.remove();
    }
  }

  /** The error's kind and message, without its trace (a stack overflow's is a thousand lines). */
  static String describe(Throwable e) {
    String message = e.getMessage();
    return e.getClass().getSimpleName() + (message == null || message.isBlank() ? ""
        : ": " + message.strip().split("\n", 2)[0]);
  }

  /** Waits {@code ms}, or less if woken: by a submission, or by {@link #stop}. */
  private void sleepQuietly(long ms) {
    try {
      wake.tryAcquire(ms, TimeUnit.MILLISECONDS);
      wake.drainPermits();
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      running = false;
    }
  }

  /** Whether the worker's thread is there and deciding tickets. */
  boolean alive() {
    Thread t = thread;
    return running && t != null && t.isAlive();
  }

  @Override
  public void stop() {
    running = false;
    wake.release();
    Thread t = thread;
    if (t != null) {
      try {
        // A decision in progress finishes and is stored; after that the thread ends.
        t.join(30_000);
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
