package org.precedent.api.system;

import io.micrometer.core.instrument.Counter;
import io.micrometer.core.instrument.MeterRegistry;
import io.micrometer.core.instrument.Tags;
import io.micrometer.core.instrument.Timer;
import io.micrometer.core.instrument.binder.jvm.ExecutorServiceMetrics;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.FutureTask;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.concurrent.Semaphore;
import java.util.concurrent.ThreadPoolExecutor;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.Supplier;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.stereotype.Component;

/**
 * Runs the decisions asked for over HTTP on a fixed set of threads, a few at a time, with a short
 * line of waiting requests; a request beyond the line, or one that waited its time in it, is
 * refused with {@link Busy} (503 and Retry-After) rather than left to queue without end.
 *
 * <p>The reranker keeps one copy of its network per processor ({@code engine.rerank.Scorer}), so
 * as many decisions as there are processors score at once and more only lengthen every wait. And
 * each thread that scores keeps its own native working memory (the network's
 * workspaces are per thread): deciding on these threads alone keeps that memory to a few sets,
 * however many connection threads the server has.
 */
@Component
public final class DecisionSlots implements AutoCloseable {
  private final int concurrent;
  private final int queue;
  private final long waitMs;
  private final int retryAfterSeconds;
  private final ThreadPoolExecutor pool;
  // Decisions running or waiting for a slot: beyond this, a request is refused at once.
  private final Semaphore line;
  // Decisions running: as many as the pool has threads, handed out in the order asked for.
  private final Semaphore slots;
  private final Counter refusedFull;
  private final Counter refusedWait;
  private final Timer deciding;

  DecisionSlots(@Value("${precedent.decisions.concurrent}") int concurrent,
      @Value("${precedent.decisions.queue}") int queue,
      @Value("${precedent.decisions.wait-ms}") long waitMs,
      @Value("${precedent.decisions.retry-after-seconds}") int retryAfterSeconds,
      MeterRegistry meters) {
    if (concurrent < 0 || queue < 0 || waitMs < 0 || retryAfterSeconds < 1) {
      throw new IllegalArgumentException("precedent.decisions: concurrent, queue and wait-ms must "
          + "be 0 or more and retry-after-seconds at least 1 (concurrent " + concurrent
          + ", queue " + queue + ", wait-ms " + waitMs + ", retry-after-seconds "
          + retryAfterSeconds + ")");
    }
    this.concurrent = concurrent == 0 ? Runtime.getRuntime().availableProcessors() : concurrent;
    this.queue = queue;
    this.waitMs = waitMs;
    this.retryAfterSeconds = retryAfterSeconds;
    AtomicInteger n = new AtomicInteger();
    this.pool = new ThreadPoolExecutor(this.concurrent, this.concurrent, 0, TimeUnit.SECONDS,
        new LinkedBlockingQueue<>(), r -> {
          Thread t = new Thread(r, "decide-" + n.incrementAndGet());
          t.setDaemon(true);
          return t;
        });
    this.line = new Semaphore(this.concurrent + queue);
    this.slots = new Semaphore(this.concurrent, true);
    new ExecutorServiceMetrics(pool, "decisions", Tags.empty()).bindTo(meters);
    this.refusedFull = Counter.builder("precedent.decisions.refused").tag("why", "line_full")
        .description("decisions refused because the line of waiting ones was full")
        .register(meters);
    this.refusedWait = Counter.builder("precedent.decisions.refused").tag("why", "waited_too_long")
        .description("decisions refused after waiting their longest in the line")
        .register(meters);
    this.deciding = Timer.builder("precedent.decisions.run")
        .description("decisions run on the decision threads, from start to end")
        .register(meters);
  }

  /** How many decisions may run at once. */
  public int concurrent() {
    return concurrent;
  }

  /** Decisions running or waiting now. */
  public int inProgress() {
    return concurrent + queue - line.availablePermits();
  }

  /**
   * Runs {@code work} on a decision thread and returns its result, its exception unchanged.
   *
   * @throws Busy when the line is full, or no slot came free within the longest wait
   */
  public <T> T run(Supplier<T> work) {
    if (!line.tryAcquire()) {
      refusedFull.increment();
      throw new Busy(retryAfterSeconds, "all " + concurrent + " decision slots are busy and "
          + queue + " more requests are waiting");
    }
    try {
      if (!slots.tryAcquire(waitMs, TimeUnit.MILLISECONDS)) {
        refusedWait.increment();
        throw new Busy(retryAfterSeconds, "no decision slot came free within " + waitMs + " ms");
      }
      // Holding a slot means one of the pool's threads is free (or about to be): no more waiting.
      FutureTask<T> task = new FutureTask<>(() -> {
        long start = System.nanoTime();
        try {
          return work.get();
        } finally {
          deciding.record(System.nanoTime() - start, TimeUnit.NANOSECONDS);
          slots.release();
        }
      });
      try {
        pool.execute(task);
      } catch (RuntimeException e) {
        slots.release();
        throw e;
      }
      return task.get();
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException("interrupted while waiting for a decision", e);
    } catch (ExecutionException e) {
      Throwable cause = e.getCause();
      if (cause instanceof RuntimeException r) {
        throw r;
      }
      if (cause instanceof Error err) {
        throw err;
      }
      throw new IllegalStateException(cause);
    } finally {
      line.release();
    }
  }

  @Override
  public void close() {
    pool.shutdownNow();
  }

  /** Too many decisions in progress: come back in {@link #retryAfterSeconds()} seconds. */
  public static final class Busy extends RuntimeException {
    private final int retryAfterSeconds;

    Busy(int retryAfterSeconds, String message) {
      super(message);
      this.retryAfterSeconds = retryAfterSeconds;
    }

    public int retryAfterSeconds() {
      return retryAfterSeconds;
    }
  }
}
