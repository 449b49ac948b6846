package org.precedent.api.pages;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.Map;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.support.ui.Select;
import org.precedent.api.testing.Browser;
import org.precedent.api.testing.Http;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.RunningService;
import org.precedent.api.testing.TrainedData;

/**
 * The queue page in Chromium: the list newest first, a filter, a decision opened, a question of
 * markup shown as text, and a ticket that could not be decided showing why.
 *
 * <p>The failure is a real one ({@link TrainedData#copyWithOverflowingRule}): a safety rule with a
 * repeated group overflows the stack of the thread that matches it.
 */
class QueueBrowserTest {
  static final String HOSTILE = "<script>window.__pwned=1</script><img src=x "
      + "onerror=\"window.__pwned=2\"><b>bold</b> when is my bin collected?";
  static RunningService service;
  static Http http;
  static Browser browser;

  @BeforeAll
  static void start() throws InterruptedException {
    browser = Browser.open("http://localhost:0"); // skips here when Chromium is absent
    browser.close();
    service = RunningService.startOn(TrainedData.copyWithOverflowingRule(), "--precedent.queue.poll-ms=100");
    http = service.http();
    submit("P-1", "How do I read my water meter?");
    submit("P-2", HOSTILE);
    submit("P-3", TrainedData.OVERFLOWING_QUESTION);
    for (String[] t : new String[][] {{"P-1", "DECIDED"}, {"P-2", "DECIDED"}, {"P-3", "FAILED"}}) {
      awaitState(t[0], t[1]);
    }
    browser = Browser.open(http.base());
  }

  private static void submit(String id, String question) {
    assertEquals(202, http.post("/api/v1/queue/tickets", Map.of("ticketId", id, "question",
        question), Caller.QUEUE).status());
  }

  private static JsonNode awaitState(String id, String state) throws InterruptedException {
    for (int i = 0; i < 600; i++) {
      JsonNode t = http.get("/api/v1/queue/tickets/" + id, Caller.AGENT).json();
      if (t.get("status").asText().equals(state)) {
        return t;
      }
      Thread.sleep(50);
    }
    throw new AssertionError("ticket " + id + " did not become " + state + " within 30 s");
  }

  @AfterAll
  static void stop() {
    if (browser != null) {
      browser.close();
    }
    if (service != null) {
      service.close();
    }
  }

  private void signIn() {
    browser.go("/queue");
    browser.script("sessionStorage.clear()");
    browser.go("/queue");
    browser.visible("#api-key");
    browser.type("#api-key", "demo-agent-key");
    browser.find("#sign-in").click();
    browser.visible("#tickets tbody tr");
  }

  private void open(String id) {
    browser.find("#tickets tbody button[data-id='" + id + "']").click();
    browser.showing("#detail-title", id);
  }

  @Test
  void theListIsNewestFirstAndFiltersByState() {
    signIn();
    var ids = browser.all("#tickets tbody button.link").stream().map(b -> b.getText()).toList();
    assertEquals(java.util.List.of("P-3", "P-2", "P-1"), ids);
    browser.showing("#list-status", "3 tickets");
    new Select(browser.find("#state")).selectByValue("failed");
    browser.find("#filter-button").click();
    browser.showing("#list-status", "1 ticket,");
    assertEquals("P-3", browser.find("#tickets tbody button.link").getText());
    assertTrue(browser.find("#tickets tbody td.why").getText().contains("ran out of stack"),
        browser.find("#tickets tbody").getText());
  }

  @Test
  void aDecidedTicketOpensItsDecisionAndAFilterByReasonKeepsOnlyThose() {
    signIn();
    JsonNode stored = http.get("/api/v1/queue/tickets/P-1", Caller.AGENT).json().get("decision");
    open("P-1");
    browser.visible("#decision");
    assertTrue(browser.find("#confidence").getText().startsWith("Confidence "),
        browser.find("#confidence").getText());
    assertTrue(browser.find("#decision").getText().contains(stored.get("explanation").asText()),
        browser.find("#decision").getText());
    if (stored.get("outcome").asText().equals("HAND_OFF")) {
      assertEquals(stored.get("candidates").get(0).get("answer").asText(),
          browser.find("#detail-best-text").getText().strip());
      new Select(browser.find("#reason")).selectByValue(stored.get("reason").asText());
      browser.find("#filter-button").click();
      browser.waiting().until(d -> browser.all("#tickets tbody td.why").stream()
          .allMatch(e -> e.getText().equals(stored.get("reason").asText().replace('_', ' '))));
      assertTrue(browser.all("#tickets tbody tr").stream()
          .noneMatch(r -> r.getText().contains("P-3")), "the failed ticket has no reason");
    }
  }

  @Test
  void aQuestionOfMarkupIsShownAsTextAndRunsNothing() {
    signIn();
    String question = http.get("/api/v1/queue/tickets/P-2", Caller.AGENT).json()
        .get("question").asText();
    assertTrue(question.contains("<script>"), question);
    browser.type("#search", "bin collected");
    browser.find("#filter-button").click();
    browser.showing("#list-status", "1 ticket,");
    assertEquals(question, browser.find("#tickets tbody td.question").getText().strip());
    open("P-2");
    assertEquals(question, browser.find("#detail-question").getText().strip());
    assertEquals("undefined", browser.script("return typeof window.__pwned"));
    assertTrue(browser.all("main script, main img, #tickets b, #detail b").isEmpty(),
        "markup became elements");
  }

  @Test
  void aTicketThatCouldNotBeDecidedShowsWhy() {
    signIn();
    open("P-3");
    browser.visible("#detail-failure");
    assertTrue(browser.find("#detail-failure-text").getText().contains("ran out of stack"),
        browser.find("#detail-failure-text").getText());
    assertTrue(browser.all("#detail-decision *").isEmpty(), "a failed ticket has no decision");
    assertTrue(browser.find("#detail-facts").getText().contains("3 tries"),
        browser.find("#detail-facts").getText());
  }
}
