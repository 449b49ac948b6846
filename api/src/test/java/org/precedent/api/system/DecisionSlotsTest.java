package org.precedent.api.system;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import io.micrometer.core.instrument.simple.SimpleMeterRegistry;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.junit.jupiter.api.Test;

/** The decision slots on their own: how many run, who waits, who is refused, on which threads. */
class DecisionSlotsTest {

  private static DecisionSlots slots(int concurrent, int queue, long waitMs) {
    return new DecisionSlots(concurrent, queue, waitMs, 2, new SimpleMeterRegistry());
  }

  @Test
  void workRunsOnTheSlotsOwnThreadsAndNoMoreOfThemThanSlots() throws Exception {
    Set<Thread> ran = ConcurrentHashMap.newKeySet();
    Set<Thread> callers = ConcurrentHashMap.newKeySet();
    try (DecisionSlots slots = slots(2, 100, 60_000)) {
      ExecutorService pool = Executors.newFixedThreadPool(16);
      List<Future<Integer>> results = new ArrayList<>();
      for (int i = 0; i < 160; i++) {
        int n = i;
        results.add(pool.submit(() -> {
          callers.add(Thread.currentThread());
          return slots.run(() -> {
            ran.add(Thread.currentThread());
            return n * n;
          });
        }));
      }
      for (int i = 0; i < results.size(); i++) {
        assertEquals(i * i, results.get(i).get());
      }
      pool.shutdown();
    }
    assertTrue(ran.size() >= 1 && ran.size() <= 2, ran.toString());
    for (Thread t : ran) {
      assertFalse(callers.contains(t), t.getName());
    }
  }

  @Test
  void whenTheLineIsFullTheNextIsRefusedAtOnce() throws Exception {
    try (DecisionSlots slots = slots(1, 0, 60_000)) {
      ExecutorService pool = Executors.newSingleThreadExecutor();
      Held held = holdTheSlot(slots, pool);
      DecisionSlots.Busy busy = assertThrows(DecisionSlots.Busy.class,
          () -> slots.run(() -> "never"));
      assertEquals(2, busy.retryAfterSeconds());
      assertTrue(busy.getMessage().contains("all 1 decision slots are busy"), busy.getMessage());
      assertEquals("done", held.finish());
      assertEquals("next", slots.run(() -> "next"));
      pool.shutdown();
    }
  }

  @Test
  void aWaitInTheLineEndsWithARefusalWhenNoSlotFrees() throws Exception {
    try (DecisionSlots slots = slots(1, 1, 50)) {
      ExecutorService pool = Executors.newSingleThreadExecutor();
      Held held = holdTheSlot(slots, pool);
      DecisionSlots.Busy busy = assertThrows(DecisionSlots.Busy.class,
          () -> slots.run(() -> "never"));
      assertTrue(busy.getMessage().contains("within 50 ms"), busy.getMessage());
      // The refused request left the line: only the held one is still in progress.
      assertEquals(1, slots.inProgress());
      assertEquals("done", held.finish());
      assertEquals(0, slots.inProgress());
      pool.shutdown();
    }
  }

  @Test
  void theWorksOwnExceptionReachesTheCallerUnchanged() {
    try (DecisionSlots slots = slots(1, 0, 0)) {
      IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
          () -> slots.run(() -> {
            throw new IllegalArgumentException("no such category");
          }));
      assertEquals("no such category", e.getMessage());
      assertEquals(0, slots.inProgress());
      assertEquals("after", slots.run(() -> "after"));
    }
  }

  @Test
  void settingsOutOfRangeAreRefusedWithTheirNames() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> slots(1, -1, 0));
    assertTrue(e.getMessage().contains("queue -1"), e.getMessage());
  }

  /** A decision in the only slot that runs until it is released. */
  private record Held(CountDownLatch release, Future<String> done) {
    String finish() throws Exception {
      release.countDown();
      return done.get();
    }
  }

  private static Held holdTheSlot(DecisionSlots slots, ExecutorService pool)
      throws InterruptedException {
    CountDownLatch holding = new CountDownLatch(1);
    CountDownLatch release = new CountDownLatch(1);
    Future<String> done = pool.submit(() -> slots.run(() -> {
      holding.countDown();
      await(release);
      return "done";
    }));
    holding.await();
    return new Held(release, done);
  }

  private static void await(CountDownLatch latch) {
    try {
      latch.await();
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
  }
}
