package org.precedent.api.system;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.net.Socket;
import java.net.SocketTimeoutException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.precedent.api.testing.RunningService;

/**
 * Clients that send a request's headers and then only part of its body, on a real socket, with
 * the service's own settings: the server closes them soon, and meanwhile they hold none of the
 * threads that other requests (health checks, decisions) need.
 */
class SlowClientsTest {
  private static final byte[] BODY = ("{\"question\": \"My green bin was not emptied this week, "
      + "can someone come back?\"}").getBytes(StandardCharsets.UTF_8);
  /**
   * How long a stalled client may be kept at most: the service's settings say 10 s of silence
   * (server.tomcat.connection-timeout) and 15 s for a whole body (precedent.limits.body-seconds);
   * twice the longer one leaves room for a slow machine.
   */
  private static final int MOST_MS = 30_000;

  static RunningService service;
  static int port;

  @BeforeAll
  static void start() {
    service = RunningService.start();
    port = URI.create(service.http().base()).getPort();
  }

  @AfterAll
  static void stop() {
    service.close();
  }

  @Test
  void aBodyThatStallsHalfwayIsClosedByTheServer() throws IOException {
    try (Socket s = stalled()) {
      s.setSoTimeout(MOST_MS);
      // A time-out here (the server still waiting for the rest) fails the test.
      String answer = readToEnd(s.getInputStream());
      assertTrue(answer.isEmpty() || answer.startsWith("HTTP/1.1 408"), answer);
    }
  }

  @Test
  void aBodyThatTricklesInIsRefusedWhenItsTimeIsUp() throws Exception {
    try (Socket s = new Socket("127.0.0.1", port)) {
      OutputStream out = s.getOutputStream();
      out.write(headers());
      out.flush();
      // One byte every 2 s: never silent long enough for the connection time-out, yet the body
      // would take minutes. The body's own time limit ends it.
      s.setSoTimeout(2_000);
      InputStream in = s.getInputStream();
      ByteArrayOutputStream answer = new ByteArrayOutputStream();
      for (int i = 0; i < BODY.length && answer.size() == 0; i++) {
        out.write(BODY[i]);
        out.flush();
        try {
          int b = in.read();
          if (b < 0) {
            break;
          }
          answer.write(b);
        } catch (SocketTimeoutException e) {
          // Nothing yet: send the next byte.
        }
      }
      s.setSoTimeout(MOST_MS);
      answer.write(in.readAllBytes());
      String text = answer.toString(StandardCharsets.ISO_8859_1);
      assertTrue(text.startsWith("HTTP/1.1 408"), text);
      assertTrue(text.contains("\"status\":408") && text.contains("did not arrive within"), text);
    }
  }

  @Test
  void healthAndDecisionsAnswerWhileThreeHundredBodiesStall() throws Exception {
    // More stalled clients than the server has worker threads (200 by default).
    List<Socket> stalled = new ArrayList<>();
    try {
      for (int i = 0; i < 300; i++) {
        stalled.add(stalled());
      }
      HttpClient client = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(10)).build();
      HttpResponse<String> health = client.send(HttpRequest.newBuilder(
              URI.create(service.http().base() + "/actuator/health"))
          .timeout(Duration.ofSeconds(10)).GET().build(), HttpResponse.BodyHandlers.ofString());
      assertEquals(200, health.statusCode(), health.body());
      HttpResponse<String> decision = client.send(HttpRequest.newBuilder(
              URI.create(service.http().base() + "/api/v1/decisions"))
          .timeout(Duration.ofSeconds(20)).header("Content-Type", "application/json")
          .header("X-Precedent-Key", "demo-agent-key")
          .POST(HttpRequest.BodyPublishers.ofByteArray(BODY)).build(),
          HttpResponse.BodyHandlers.ofString());
      assertEquals(200, decision.statusCode(), decision.body());
    } finally {
      for (Socket s : stalled) {
        s.close();
      }
    }
  }

  /** A connection that has sent the headers of a decision request and half its body. */
  private static Socket stalled() throws IOException {
    Socket s = new Socket("127.0.0.1", port);
    OutputStream out = s.getOutputStream();
    out.write(headers());
    out.write(BODY, 0, BODY.length / 2);
    out.flush();
    return s;
  }

  private static byte[] headers() {
    return ("POST /api/v1/decisions HTTP/1.1\r\nHost: 127.0.0.1\r\n"
        + "Content-Type: application/json\r\nX-Precedent-Key: demo-agent-key\r\n"
        + "Content-Length: " + BODY.length + "\r\n\r\n").getBytes(StandardCharsets.US_ASCII);
  }

  /** What the server sent before it closed the connection (a reset counts as a close). */
  private static String readToEnd(InputStream in) throws IOException {
    ByteArrayOutputStream got = new ByteArrayOutputStream();
    byte[] buffer = new byte[4096];
    try {
      for (int n; (n = in.read(buffer)) >= 0; ) {
        got.write(buffer, 0, n);
      }
    } catch (java.net.SocketException reset) {
      // Closed by the server without a goodbye: closed all the same.
    }
    return got.toString(StandardCharsets.ISO_8859_1);
  }
}
