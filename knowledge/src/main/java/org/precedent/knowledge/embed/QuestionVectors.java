package org.precedent.knowledge.embed;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicLong;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.ticket.Ticket;

/**
 * The vectors of tickets' questions for a new generation, made by one encoder: a vector the
 * previous generation already holds for the same question by the same encoder is taken over, the
 * rest are embedded, one thread per processor (one model run per question, so a stored vector
 * equals the vector of the same question asked later), with progress.
 */
public final class QuestionVectors {
  private QuestionVectors() {}

  /** A vector the previous generation holds, with the question it was made from. */
  public record Stored(String question, float[] vector) {}

  /**
   * @param previous the previous generation's vectors by ticket id, made by this same encoder
   *                 (empty when it had none or another encoder made them)
   * @return a vector for every ticket, by ticket id
   */
  public static Map<String, float[]> of(List<Ticket> tickets, SentenceEncoder encoder,
      Map<String, Stored> previous, Progress progress) {
    Map<String, float[]> out = new HashMap<>();
    List<Ticket> todo = new ArrayList<>();
    for (Ticket t : tickets) {
      Stored s = previous.get(t.id());
      if (s != null && s.question().equals(t.question())
          && s.vector().length == encoder.dimension()) {
        out.put(t.id(), s.vector());
      } else {
        todo.add(t);
      }
    }
    progress.total(todo.size());
    if (todo.isEmpty()) {
      progress.finish(0);
      return out;
    }
    int threads = Math.max(1, Math.min(Runtime.getRuntime().availableProcessors(), todo.size()));
    AtomicLong done = new AtomicLong();
    float[][] vectors = new float[todo.size()][];
    ExecutorService pool = Executors.newFixedThreadPool(threads, r -> {
      Thread t = new Thread(r, "embedding");
      t.setDaemon(true);
      return t;
    });
    try {
      List<Future<?>> parts = new ArrayList<>();
      for (int w = 0; w < threads; w++) {
        int first = w;
        parts.add(pool.submit(() -> {
          for (int i = first; i < vectors.length; i += threads) {
            vectors[i] = encoder.embed(todo.get(i).question());
            long d = done.incrementAndGet();
            synchronized (progress) {
              progress.update(d);
            }
          }
        }));
      }
      for (Future<?> part : parts) {
        part.get();
      }
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException("embedding the questions was interrupted", e);
    } catch (ExecutionException e) {
      Throwable cause = e.getCause();
      throw cause instanceof RuntimeException r ? r : new IllegalStateException(cause);
    } finally {
      pool.shutdownNow();
    }
    progress.finish(todo.size());
    for (int i = 0; i < vectors.length; i++) {
      out.put(todo.get(i).id(), vectors[i]);
    }
    return out;
  }
}
