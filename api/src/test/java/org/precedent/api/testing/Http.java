package org.precedent.api.testing;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.Base64;

/** A small JSON client for the running service, as the tests' callers would use it. */
public final class Http {
  public static final ObjectMapper JSON = new ObjectMapper();

  /** Who calls: an API key, HTTP basic, or nobody. */
  public record Caller(String header, String value) {
    public static final Caller NOBODY = new Caller(null, null);
    public static final Caller AGENT = key("demo-agent-key");
    public static final Caller MANAGER = key("demo-manager-key");
    public static final Caller QUEUE = key("demo-queue-key");

    public static Caller key(String key) {
      return new Caller("X-Precedent-Key", key);
    }

    public static Caller basic(String user, String password) {
      return new Caller("Authorization", "Basic " + Base64.getEncoder().encodeToString(
          (user + ":" + password).getBytes(StandardCharsets.UTF_8)));
    }
  }

  /** A response: status, headers and the body as JSON (null when it is not JSON). */
  public record Reply(int status, HttpResponse<String> raw, JsonNode json) {
    public String header(String name) {
      return raw.headers().firstValue(name).orElse(null);
    }
  }

  private final String base;
  private final HttpClient client = HttpClient.newBuilder()
      .connectTimeout(Duration.ofSeconds(10)).build();

  public Http(int port) {
    this.base = "http://localhost:" + port;
  }

  public String base() {
    return base;
  }

  public Reply get(String path, Caller caller) {
    return send(builder(path, caller).GET().build());
  }

  public Reply post(String path, Object body, Caller caller) {
    return send("POST", path, body, caller);
  }

  public Reply put(String path, Object body, Caller caller) {
    return send("PUT", path, body, caller);
  }

  public Reply send(String method, String path, Object body, Caller caller) {
    String text;
    try {
      text = body instanceof String s ? s : JSON.writeValueAsString(body);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return send(builder(path, caller).header("Content-Type", "application/json")
        .method(method, HttpRequest.BodyPublishers.ofString(text)).build());
  }

  /**
   * Waits until {@code /actuator/health} answers 200 (every part UP), at most 30 s; {@code after}
   * names what the service recovers from, for the failure's message.
   */
  public void awaitHealthy(String after) throws InterruptedException {
    Reply last = null;
    for (int i = 0; i < 300; i++) {
      last = get("/actuator/health", Caller.MANAGER);
      if (last.status() == 200) {
        return;
      }
      Thread.sleep(100);
    }
    throw new AssertionError("not healthy 30 s after " + after + ": " + last.raw().body());
  }

  private HttpRequest.Builder builder(String path, Caller caller) {
    HttpRequest.Builder b = HttpRequest.newBuilder(URI.create(base + path))
        .timeout(Duration.ofSeconds(60));
    if (caller.header() != null) {
      b.header(caller.header(), caller.value());
    }
    return b;
  }

  private Reply send(HttpRequest request) {
    try {
      HttpResponse<String> r = client.send(request, HttpResponse.BodyHandlers.ofString());
      JsonNode json = null;
      String type = r.headers().firstValue("Content-Type").orElse("");
      if (type.contains("json") && !r.body().isEmpty()) {
        json = JSON.readTree(r.body());
      }
      return new Reply(r.statusCode(), r, json);
    } catch (IOException e) {
      throw new UncheckedIOException(request.method() + " " + request.uri(), e);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException(e);
    }
  }
}
