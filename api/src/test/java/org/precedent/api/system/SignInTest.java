package org.precedent.api.system;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.util.Map;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.precedent.api.testing.Http;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.RunningService;
import org.springframework.boot.test.system.CapturedOutput;
import org.springframework.boot.test.system.OutputCaptureExtension;
import org.springframework.security.crypto.bcrypt.BCryptPasswordEncoder;

/**
 * Sign-in against the real service configured with its own users (no keys): the demo credentials
 * are all off, failures are logged and limited per client address and per user name. The service
 * trusts forwarded headers from loopback (as behind a reverse proxy on the same machine), so each
 * test plays clients of its own addresses (RFC 5737 documentation ranges).
 */
@ExtendWith(OutputCaptureExtension.class)
class SignInTest {
  static final int PER_ADDRESS = 4;
  static final int PER_NAME = 3;
  static RunningService service;
  static String startOutput;
  final HttpClient client = HttpClient.newHttpClient();

  @BeforeAll
  static void start(CapturedOutput output) {
    // bcrypt strength 4, the least it allows, keeps the test quick; the work is counted, not timed.
    String bo = new BCryptPasswordEncoder(4).encode("bo-pw-2");
    service = RunningService.start(
        "--precedent.security.users=ana:ana-pw-1:manager,bo:{bcrypt}" + bo + ":agent,"
            + "cy:cy-pw-3:queue",
        "--precedent.security.failed-sign-ins.per-address=" + PER_ADDRESS,
        "--precedent.security.failed-sign-ins.per-name=" + PER_NAME,
        "--server.forward-headers-strategy=native");
    startOutput = output.getAll();
  }

  @AfterAll
  static void stop() {
    service.close();
  }

  record Answer(int status, String retryAfter, JsonNode json) {}

  /** GET the threshold as {@code caller}, from {@code address} as the forwarding proxy says. */
  Answer get(String address, Caller caller) throws IOException, InterruptedException {
    HttpRequest.Builder b = HttpRequest.newBuilder(URI.create(service.http().base()
        + "/api/v1/threshold")).header("X-Forwarded-For", address);
    if (caller.header() != null) {
      b.header(caller.header(), caller.value());
    }
    HttpResponse<String> r = client.send(b.build(), HttpResponse.BodyHandlers.ofString());
    String type = r.headers().firstValue("Content-Type").orElse("");
    return new Answer(r.statusCode(), r.headers().firstValue("Retry-After").orElse(null),
        type.contains("json") ? Http.JSON.readTree(r.body()) : null);
  }

  @Test
  void customUsersAloneSwitchOffEveryDemoCredential() throws Exception {
    String from = "203.0.113.10";
    assertEquals(401, get(from, Caller.MANAGER).status());
    assertEquals(401, service.http().put("/api/v1/threshold", Map.of("threshold", 0.5,
        "reason", "demo key"), Caller.MANAGER).status());
    assertEquals(401, get(from, Caller.basic("manager", "manager-demo-password")).status());
    assertEquals(200, get(from, Caller.basic("ana", "ana-pw-1")).status());
    assertFalse(startOutput.contains("demo credentials in force"), startOutput);
  }

  @Test
  void anAddressIsAnswered429WithRetryAfterOnceItsFailuresAreUsedUp() throws Exception {
    String from = "203.0.113.20";
    for (int i = 0; i < PER_ADDRESS; i++) {
      assertEquals(401, get(from, Caller.basic("guess-" + i, "pw-" + i)).status());
    }
    // Refused before its credentials are looked at, even the right ones.
    Answer refused = get(from, Caller.basic("ana", "ana-pw-1"));
    assertEquals(429, refused.status());
    long wait = Long.parseLong(refused.retryAfter());
    assertTrue(wait >= 1 && wait <= 60, refused.retryAfter());
    // RFC 9457 problem details, as every other error of the service.
    assertEquals(429, refused.json().get("status").asInt());
    assertEquals("Too Many Requests", refused.json().get("title").asText());
    assertTrue(refused.json().get("detail").asText().contains(from),
        refused.json().toString());
    assertEquals(429, get(from, Caller.key("some-key")).status());
    // Another client is not held up.
    assertEquals(200, get("203.0.113.21", Caller.basic("ana", "ana-pw-1")).status());
  }

  @Test
  void aUserNameIsAnswered429OnceItsFailuresAreUsedUpFromAnyAddresses() throws Exception {
    for (int i = 0; i < PER_NAME; i++) {
      assertEquals(401, get("198.51.100." + (30 + i), Caller.basic("cy", "guess-" + i)).status());
    }
    Answer refused = get("198.51.100.40", Caller.basic("cy", "cy-pw-3"));
    assertEquals(429, refused.status());
    assertTrue(Long.parseLong(refused.retryAfter()) >= 1);
    assertTrue(refused.json().get("detail").asText().contains("user name"));
    assertEquals(200, get("198.51.100.40", Caller.basic("ana", "ana-pw-1")).status());
  }

  @Test
  void everyPasswordCheckDoesTheSameWorkForKnownAndUnknownNames() throws Exception {
    Credentials credentials = service.bean(Credentials.class);
    String from = "203.0.113.60";
    Caller[] attempts = {Caller.basic("ana", "wrong"), Caller.basic("nobody", "wrong"),
        Caller.basic("ana", "ana-pw-1"), Caller.basic("bo", "bo-pw-2")};
    for (Caller attempt : attempts) {
      Credentials.Work before = credentials.work();
      get(from, attempt);
      // One digest and, as one user's password is bcrypt, one bcrypt check: for every name.
      assertEquals(new Credentials.Work(before.digests() + 1, before.bcryptChecks() + 1),
          credentials.work(), attempt.value());
    }
  }

  @Test
  void failedSignInsAreLoggedWithNameAddressAndReasonButNoSecret(CapturedOutput output)
      throws Exception {
    String from = "203.0.113.70";
    get(from, Caller.basic("bo", "s3cret-guess-1"));
    get(from, Caller.basic("nobody\nforged line", "s3cret-guess-2"));
    get(from, Caller.key("k3y-guess-3"));
    String log = output.getAll();
    assertTrue(log.contains("failed sign-in as 'bo' from " + from + ": wrong password"), log);
    assertTrue(log.contains("failed sign-in as 'nobody?forged line' from " + from
        + ": no such user"), log);
    assertTrue(log.contains("failed sign-in from " + from + ": the API key is not known"), log);
    assertFalse(log.contains("s3cret-guess") || log.contains("k3y-guess"), log);
  }
}
