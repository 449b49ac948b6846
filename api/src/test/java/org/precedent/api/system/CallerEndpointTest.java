package org.precedent.api.system;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.RegisterExtension;
import org.precedent.api.testing.Http;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.Http.Reply;
import org.precedent.api.testing.ServiceForClass;

/** Who am I: the call every role may make, with which the pages check credentials at sign-in. */
class CallerEndpointTest {
  @RegisterExtension
  static final ServiceForClass service = new ServiceForClass();

  private static Http http() {
    return service.http();
  }

  @Test
  void everyRoleLearnsItsNameAndRole() {
    Reply agent = http().get("/api/v1/me", Caller.AGENT);
    assertEquals(200, agent.status());
    assertEquals("agent", agent.json().get("role").asText(), agent.json().toString());
    assertTrue(agent.json().hasNonNull("name"), agent.json().toString());
    Reply queue = http().get("/api/v1/me", Caller.QUEUE);
    assertEquals("queue", queue.json().get("role").asText());
    Reply manager = http().get("/api/v1/me", Caller.basic("manager", "manager-demo-password"));
    assertEquals(200, manager.status());
    assertEquals("manager", manager.json().get("name").asText());
    assertEquals("manager", manager.json().get("role").asText());
  }

  @Test
  void aWrongKeyOrPasswordOrNoneIsRefusedWithTheReason() {
    Reply key = http().get("/api/v1/me", Caller.key("not-a-key"));
    assertEquals(401, key.status());
    assertTrue(key.json().get("detail").asText().contains("not known"), key.json().toString());
    assertEquals(401, http().get("/api/v1/me", Caller.basic("agent", "wrong")).status());
    assertEquals(401, http().get("/api/v1/me", Caller.NOBODY).status());
  }

  @Test
  void theAgentPageIsAtAnswersUnderThePagePolicy() {
    Reply page = http().get("/answers", Caller.NOBODY);
    assertEquals(200, page.status());
    assertTrue(page.raw().body().contains("<title>Precedent · Answers</title>"),
        page.raw().body());
    assertTrue(page.header("Content-Security-Policy").contains("script-src 'self'"));
    // The old address is gone: nothing was released under it.
    assertNotEquals(200, http().get("/desk", Caller.NOBODY).status());
  }
}
