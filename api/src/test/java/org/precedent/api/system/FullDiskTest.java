package org.precedent.api.system;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.precedent.api.testing.Http;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.Http.Reply;
import org.precedent.api.testing.RunningService;
import org.precedent.api.testing.TrainedData;

/**
 * The service's database on a real, small file system that is then filled up: submissions get a
 * 503 with Retry-After while nothing can be written, health reports the database DOWN, nothing
 * acknowledged is lost, and once space is freed the service works again without a restart.
 *
 * <p>The file system is a 16 MB tmpfs mounted over {@code DATA/service}, which needs root with
 * the right to mount (as in CI); elsewhere the test is skipped and says why.
 */
class FullDiskTest {

  @Test
  void aFullDiskIsA503AndTheServiceRecoversOnceSpaceIsFreed() throws Exception {
    Path data = TrainedData.copy();
    Path service = data.resolve("service");
    Files.createDirectories(service);
    String mounted = run("mount", "-t", "tmpfs", "-o", "size=16m", "tmpfs", service.toString());
    if (mounted != null) {
      TrainedData.delete(data);
      Assumptions.abort("a full disk needs a small file system of its own, and mounting one "
          + "failed (root with the right to mount is needed): " + mounted);
    }
    RunningService running = null;
    try {
      running = RunningService.startOn(data, "--precedent.queue.poll-ms=100");
      Http http = running.http();
      List<String> acknowledged = new ArrayList<>();
      for (int i = 1; i <= 3; i++) {
        submit(http, "A-" + i, "How do I pay my bill? " + i, acknowledged);
      }
      for (String id : acknowledged) {
        await(http, id, "DECIDED");
      }

      fill(service.resolve("filler"));
      // The database file may hold some free space of its own: submit until a write needs more.
      Reply refused = null;
      for (int i = 1; i <= 200 && refused == null; i++) {
        Reply r = submit(http, "F-" + i, "My bin was not emptied. " + "x".repeat(15_000) + i,
            acknowledged);
        if (r.status() != 202) {
          refused = r;
        }
      }
      assertNotNull(refused, "a write failed once the disk was full");
      assertEquals(503, refused.status(), refused.raw().body());
      assertEquals("application/problem+json", refused.header("Content-Type"));
      assertNotNull(refused.header("Retry-After"));
      assertEquals("Storage unavailable", refused.json().get("title").asText());
      assertTrue(refused.json().get("detail").asText().contains("No space left on device"),
          refused.raw().body());
      assertTrue(refused.raw().body().length() < 1000, refused.raw().body());
      assertFalse(refused.raw().body().contains("\tat "), refused.raw().body());
      Reply again = submit(http, "F-again", "When is my bin day?", acknowledged);
      assertEquals(503, again.status(), "still full: " + again.raw().body());
      Reply down = http.get("/actuator/health", Caller.MANAGER);
      assertEquals(503, down.status(), down.raw().body());
      assertEquals("DOWN", down.json().get("components").get("db").get("status").asText());

      Files.delete(service.resolve("filler"));
      http.awaitHealthy("space was freed");
      submit(http, "R-1", "Can I have a second green bin?", acknowledged);
      assertTrue(acknowledged.contains("R-1"), "accepted again once space is freed");
      for (String id : acknowledged) {
        await(http, id, "DECIDED");
      }
      assertEquals(404, http.get("/api/v1/queue/tickets/F-again", Caller.QUEUE).status(),
          "a refused ticket was not kept");
    } finally {
      if (running != null) {
        running.close();
      }
      run("umount", service.toString());
      TrainedData.delete(data);
    }
  }

  private static Reply submit(Http http, String id, String question, List<String> acknowledged) {
    Reply r = http.post("/api/v1/queue/tickets", Map.of("ticketId", id, "question", question),
        Caller.QUEUE);
    if (r.status() == 202) {
      acknowledged.add(id);
    }
    return r;
  }

  /** Writes zeros until the file system refuses. */
  private static void fill(Path filler) {
    byte[] block = new byte[64 * 1024];
    try (OutputStream out = Files.newOutputStream(filler)) {
      while (true) {
        out.write(block);
      }
    } catch (IOException full) {
      assertTrue(String.valueOf(full.getMessage()).contains("No space left"), full.toString());
    }
  }


  private static JsonNode await(Http http, String id, String state) throws InterruptedException {
    Reply last = null;
    for (int i = 0; i < 600; i++) {
      last = http.get("/api/v1/queue/tickets/" + id, Caller.QUEUE);
      if (last.status() == 200 && last.json().get("status").asText().equals(state)) {
        return last.json();
      }
      Thread.sleep(50);
    }
    throw new AssertionError(id + " did not become " + state + ": " + last.raw().body());
  }

  /** Runs a command; null when it succeeded, else its exit status and output. */
  private static String run(String... command) throws IOException, InterruptedException {
    Process p;
    try {
      p = new ProcessBuilder(command).redirectErrorStream(true).start();
    } catch (IOException missing) {
      return missing.getMessage();
    }
    String output = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8).strip();
    int status = p.waitFor();
    return status == 0 ? null : "exit " + status + ": " + output;
  }
}
