package org.precedent.api.system;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.RegisterExtension;
import org.precedent.api.cli.PrecedentCommand;
import org.precedent.api.testing.Http;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.Http.Reply;
import org.precedent.api.testing.ServiceForClass;

/**
 * Decisions over HTTP are taken one at a time here (one slot, one place in the line): a request
 * beyond that is answered 503 with Retry-After at once, as a problem detail, instead of queueing
 * without end; the decisions run on the decision threads alone.
 */
class BackPressureTest {
  @RegisterExtension
  static final ServiceForClass service = new ServiceForClass("--precedent.decisions.concurrent=1",
        "--precedent.decisions.queue=1", "--precedent.decisions.wait-ms=60000",
        "--precedent.decisions.retry-after-seconds=3");

  private static Http http() {
    return service.http();
  }

  private static Map<String, Object> question(int i) {
    return Map.of("question", "My green bin was not emptied this week (" + i + ")");
  }

  @Test
  void manyDecisionsAtOnceAreAnsweredOrRefusedWithRetryAfter() throws Exception {
    int clients = 24;
    ExecutorService pool = Executors.newFixedThreadPool(clients);
    try {
      CountDownLatch go = new CountDownLatch(1);
      List<Future<Reply>> replies = new ArrayList<>();
      for (int i = 0; i < clients; i++) {
        int n = i;
        String path = n % 2 == 0 ? "/api/v1/decisions" : "/api/v1/suggestions";
        replies.add(pool.submit(() -> {
          go.await();
          return http().post(path, question(n), Caller.AGENT);
        }));
      }
      go.countDown();
      int ok = 0;
      int refused = 0;
      for (Future<Reply> f : replies) {
        Reply r = f.get();
        if (r.status() == 503) {
          refused++;
          assertBusy(r);
        } else {
          assertEquals(200, r.status(), r.raw().body());
          ok++;
        }
      }
      // Two fit (one deciding, one waiting); 24 at once cannot all have.
      assertTrue(refused > 0, "none refused");
      assertTrue(ok > 0, "none answered");
    } finally {
      pool.shutdownNow();
    }
  }

  @Test
  void aFullLineIsRefusedAtOnceWhileHealthStillAnswers() throws Exception {
    DecisionSlots slots = service.bean(DecisionSlots.class);
    CountDownLatch holding = new CountDownLatch(1);
    CountDownLatch release = new CountDownLatch(1);
    ExecutorService pool = Executors.newFixedThreadPool(2);
    try {
      // The one slot is taken by a decision that waits for the test to let it go.
      Future<Object> held = pool.submit(() -> slots.run(() -> {
        holding.countDown();
        await(release);
        return null;
      }));
      holding.await();
      // The one place in the line is taken by a request over HTTP.
      Future<Reply> waiting = pool.submit(() -> http().post("/api/v1/decisions", question(0),
          Caller.QUEUE));
      while (slots.inProgress() < 2) {
        if (waiting.isDone()) {
          fail("a decision was answered while the only slot was taken: "
              + waiting.get().status());
        }
        Thread.onSpinWait();
      }
      Reply refused = http().post("/api/v1/suggestions", question(1), Caller.AGENT);
      assertBusy(refused);
      assertTrue(refused.json().get("detail").asText().contains("1 more requests are waiting"),
          refused.raw().body());
      assertEquals(200, http().get("/actuator/health", Caller.NOBODY).status());
      release.countDown();
      held.get();
      assertEquals(200, waiting.get().status(), waiting.get().raw().body());
      assertEquals(200, http().post("/api/v1/decisions", question(2), Caller.AGENT).status());
    } finally {
      release.countDown();
      pool.shutdownNow();
    }
  }

  @Test
  void decisionsRunOnTheDecisionThreadsAlone() {
    // Each thread that scores keeps its own native working memory; only the pool's threads may.
    double before = metric("precedent.decisions.run", "");
    int answered = 0;
    for (int i = 0; i < 4; i++) {
      answered += http().post("/api/v1/decisions", question(i), Caller.AGENT).status() == 200
          ? 1 : 0;
      answered += http().post("/api/v1/suggestions", question(i), Caller.AGENT).status() == 200
          ? 1 : 0;
    }
    assertEquals(8, answered);
    assertEquals(before + 8, metric("precedent.decisions.run", ""));
    assertEquals(1.0, metric("executor.pool.max", "?tag=name:decisions"));
  }

  @Test
  void theServiceBenchmarkCountsRefusalsApartFromErrors() {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int status = PrecedentCommand.run(new PrintWriter(out, true), new PrintWriter(err, true),
        "benchmark", "service", "--url", http().base(), "--clients", "8", "--seconds", "2",
        "--runs", "2", "--pid", Long.toString(ProcessHandle.current().pid()));
    // Refusals are the service protecting itself, not failures: the run succeeds.
    assertEquals(0, status, out + "\n" + err);
    Matcher refused = Pattern.compile("refused as busy \\(503/429\\): ([0-9,]+)")
        .matcher(out.toString());
    assertTrue(refused.find(), out.toString());
    assertTrue(Integer.parseInt(refused.group(1).replace(",", "")) > 0, out.toString());
    assertTrue(out.toString().contains("errors: 0 "), out.toString());
    // The service runs in this process: its resident memory is shown before and after each run.
    for (String when : List.of("after the warm-up", "after run 1", "after run 2")) {
      assertTrue(Pattern.compile("service resident [0-9,]+ MB \\(peak [0-9,]+ MB\\) " + when)
          .matcher(out.toString()).find(), when + " in: " + out);
    }
    assertTrue(out.toString().contains("run 2:"), out.toString());
  }

  /** The first measurement of a metric (a count, for a timer). */
  private static double metric(String name, String query) {
    Reply r = http().get("/actuator/metrics/" + name + query, Caller.MANAGER);
    assertEquals(200, r.status(), name + ": " + r.raw().body());
    return r.json().get("measurements").get(0).get("value").asDouble();
  }

  private static void assertBusy(Reply r) {
    assertEquals(503, r.status(), r.raw().body());
    assertEquals("application/problem+json", r.header("Content-Type"));
    assertEquals("3", r.header("Retry-After"));
    JsonNode p = r.json();
    assertEquals(503, p.get("status").asInt());
    assertEquals("Busy", p.get("title").asText());
    assertTrue(p.get("detail").asText().endsWith("try again in 3 s"), p.toString());
  }

  private static void await(CountDownLatch latch) {
    try {
      latch.await();
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
  }
}
