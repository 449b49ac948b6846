package org.precedent.api.system;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.precedent.api.testing.Browser;
import org.precedent.api.testing.Http;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.Http.Reply;
import org.precedent.api.testing.RunningService;
import org.springframework.boot.test.system.CapturedOutput;
import org.springframework.boot.test.system.OutputCaptureExtension;

/**
 * Every endpoint refuses callers without credentials (401) and callers of another role (403); with
 * nothing configured the demo credentials are in force and announced; the OpenAPI page is open.
 */
@ExtendWith(OutputCaptureExtension.class)
class SecurityTest {
  static RunningService service;
  static Http http;
  static String startOutput;

  @BeforeAll
  static void start(CapturedOutput output) {
    service = RunningService.start();
    http = service.http();
    startOutput = output.getAll();
  }

  @AfterAll
  static void stop() {
    service.close();
  }

  /** An endpoint and the roles that may call it. The body is empty so that nothing changes. */
  record Endpoint(String method, String path, Set<String> roles) {
    @Override
    public String toString() {
      return method + " " + path;
    }
  }

  static final Map<String, Caller> ROLES = Map.of("agent", Caller.AGENT, "manager",
      Caller.MANAGER, "queue", Caller.QUEUE);

  static Stream<Endpoint> endpoints() {
    return Stream.of(
        new Endpoint("POST", "/api/v1/suggestions", Set.of("agent", "manager")),
        new Endpoint("POST", "/api/v1/decisions", Set.of("agent", "manager", "queue")),
        new Endpoint("POST", "/api/v1/queue/tickets", Set.of("queue")),
        new Endpoint("GET", "/api/v1/queue/tickets/T-1", Set.of("agent", "manager", "queue")),
        new Endpoint("POST", "/api/v1/feedback", Set.of("agent")),
        new Endpoint("GET", "/api/v1/threshold", Set.of("manager")),
        new Endpoint("PUT", "/api/v1/threshold", Set.of("manager")),
        new Endpoint("GET", "/api/v1/threshold/changes", Set.of("manager")),
        new Endpoint("GET", "/api/v1/threshold/evaluation", Set.of("manager")),
        new Endpoint("GET", "/api/v1/threshold/approval", Set.of("manager")),
        new Endpoint("GET", "/api/v1/models", Set.of("manager")),
        new Endpoint("POST", "/api/v1/models/v-0002/activation", Set.of("manager")),
        new Endpoint("GET", "/api/v1/models/v-0002/comparison", Set.of("manager")),
        new Endpoint("POST", "/api/v1/models/rollback", Set.of("manager")),
        new Endpoint("GET", "/actuator/metrics", Set.of("manager")));
  }

  private static Reply call(Endpoint e, Caller caller) {
    return e.method().equals("GET") ? http.get(e.path(), caller)
        : http.send(e.method(), e.path(), "{}", caller);
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("endpoints")
  void withoutCredentialsIs401(Endpoint e) {
    Reply r = call(e, Caller.NOBODY);
    assertEquals(401, r.status(), e.toString());
    assertEquals("application/problem+json", r.header("Content-Type"));
    assertTrue(r.json().get("detail").asText().contains("X-Precedent-Key"));
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("endpoints")
  void anUnknownKeyIs401(Endpoint e) {
    assertEquals(401, call(e, Caller.key("not-a-key")).status(), e.toString());
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("endpoints")
  void anotherRoleIs403AndTheRightOnePasses(Endpoint e) {
    for (Map.Entry<String, Caller> role : ROLES.entrySet()) {
      Reply r = call(e, role.getValue());
      if (e.roles().contains(role.getKey())) {
        // Past the security check: the empty body may be refused, but not the caller.
        assertNotEquals(401, r.status(), e + " as " + role.getKey());
        assertNotEquals(403, r.status(), e + " as " + role.getKey());
      } else {
        assertEquals(403, r.status(), e + " as " + role.getKey());
        assertEquals("Forbidden", r.json().get("title").asText());
      }
    }
  }

  @Test
  void withNoCredentialsConfiguredTheDemoOnesWorkAndAreAnnounced() {
    assertTrue(startOutput.contains("demo credentials in force"), startOutput);
    assertEquals(200, http.get("/api/v1/threshold", Caller.MANAGER).status());
  }

  @Test
  void theOpenApiPageIsBrowsableWithoutCredentials() throws Exception {
    HttpClient browser = HttpClient.newBuilder().followRedirects(HttpClient.Redirect.NORMAL)
        .build();
    HttpResponse<String> page = browser.send(HttpRequest.newBuilder(URI.create(http.base()
        + "/api/v1/docs")).build(), HttpResponse.BodyHandlers.ofString());
    assertEquals(200, page.statusCode(), page.uri().toString());
    assertTrue(page.headers().firstValue("Content-Type").orElse("").startsWith("text/html"));
    assertTrue(page.body().contains("swagger-ui"), page.body());
    assertTrue(page.headers().firstValue("Content-Security-Policy").orElse("")
        .contains("script-src 'self'"));
    Reply config = http.get("/api/v1/openapi/swagger-config", Caller.NOBODY);
    assertEquals("/api/v1/openapi", config.json().get("url").asText());
  }

  @Test
  void theOpenApiDescriptionSaysWhatItIsAndHowToSignIn() {
    Reply r = http.get("/api/v1/openapi", Caller.NOBODY);
    assertEquals(200, r.status());
    JsonNode info = r.json().get("info");
    assertEquals("Precedent API", info.get("title").asText());
    assertEquals(ApiDescription.VERSION, info.get("version").asText());
    assertTrue(info.get("description").asText().contains("hand off"), info.toString());
    JsonNode schemes = r.json().get("components").get("securitySchemes");
    assertEquals("X-Precedent-Key", schemes.get("apiKey").get("name").asText());
    assertEquals("basic", schemes.get("basic").get("scheme").asText());
    assertTrue(r.json().get("paths").has("/api/v1/decisions"));
  }

  @Test
  void theOpenApiPageRunsUnderThePagesContentPolicy() {
    try (Browser browser = Browser.open(http.base())) {
      browser.go("/api/v1/docs");
      // The title is drawn by the page's own scripts from /api/v1/openapi: they ran.
      browser.showing(".information-container .title", "Precedent API");
      String console = browser.console();
      assertFalse(console.contains("Content Security Policy"), console);
    }
  }

  @Test
  void httpBasicWorksAndAWrongPasswordDoesNot() {
    Reply ok = http.get("/api/v1/threshold", Caller.basic("manager", "manager-demo-password"));
    assertEquals(200, ok.status());
    Reply wrong = http.get("/api/v1/threshold", Caller.basic("manager", "guess"));
    assertEquals(401, wrong.status());
    Reply agent = http.get("/api/v1/threshold", Caller.basic("agent", "agent-demo-password"));
    assertEquals(403, agent.status());
  }

  @Test
  void pagesAreOpenWithAContentPolicyAndTheirCallsGetNoBrowserPasswordDialog() {
    for (String page : List.of("/", "/answers", "/manage", "/pages/answers.js")) {
      Reply r = http.get(page, Caller.NOBODY);
      assertEquals(200, r.status(), page);
      assertTrue(r.header("Content-Security-Policy").contains("script-src 'self'"), page);
    }
    Reply plain = http.get("/api/v1/threshold", Caller.NOBODY);
    assertEquals("Basic realm=\"precedent\"", plain.header("WWW-Authenticate"));
    Reply fromPage = http.get("/api/v1/threshold", new Caller("X-Requested-With",
        "XMLHttpRequest"));
    assertEquals(401, fromPage.status());
    assertEquals(null, fromPage.header("WWW-Authenticate"));
    assertEquals(null, plain.header("Content-Security-Policy"));
  }

  @Test
  void configuredEntriesMustNameAKnownRole() {
    var e = org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class,
        () -> Credentials.parse("precedent.security.users", "ana:secret:boss"));
    assertTrue(e.getMessage().contains("'boss'"), e.getMessage());
    assertTrue(e.getMessage().contains("agent, manager, queue"));
    assertEquals(List.of(new Credentials.Entry("ana", "pw", "manager")),
        Credentials.parse("precedent.security.users", " ana:pw:Manager "));
  }
}
