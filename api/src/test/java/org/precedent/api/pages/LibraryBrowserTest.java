package org.precedent.api.pages;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.Map;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.support.ui.Select;
import org.precedent.api.testing.Browser;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.RunningService;
import org.precedent.api.testing.TrainedData;

/** The library page in Chromium: a manager edits, approves and retires; markup stays text. */
class LibraryBrowserTest {
  static final String HOSTILE = "<script>window.__pwned=1</script><img src=x "
      + "onerror=\"window.__pwned=2\"><b>bold</b> put the bin out by seven";
  static RunningService service;
  static Browser browser;

  @BeforeAll
  static void start() {
    browser = Browser.open("http://localhost:0"); // skips here when Chromium is absent
    browser.close();
    service = RunningService.startOn(TrainedData.copy());
    browser = Browser.open(service.http().base());
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

  private void signIn(String key) {
    browser.go("/library");
    browser.script("sessionStorage.clear()");
    browser.go("/library");
    browser.visible("#api-key");
    browser.type("#api-key", key);
    browser.find("#sign-in").click();
    browser.visible("#answers tbody tr");
  }

  /** Opens the answer of row {@code row} and returns its id. */
  private String open(int row) {
    var button = browser.all("#answers tbody tr button.link").get(row);
    String id = button.getAttribute("data-id");
    button.click();
    browser.showing("#detail-facts", id);
    return id;
  }

  private void reason(String why) {
    browser.type("#change-reason", why);
  }

  @Test
  void aManagerEditsApprovesAndRetiresWithReasonsAndSeesTheAudit() {
    signIn("demo-manager-key");
    String id = open(0);
    browser.type("#edit-title", "Bin day, checked");
    browser.type("#edit-text", HOSTILE);
    browser.find("#save").click();
    browser.showing("#change-status", "Say why");
    reason("plainer words");
    browser.find("#save").click();
    browser.showing("#change-status", "version 2");
    // The text is shown as characters; none of it became an element or ran.
    assertEquals(HOSTILE, browser.find("#detail-text").getText());
    assertEquals("undefined", browser.script("return typeof window.__pwned"));
    assertTrue(browser.all("#detail script, #detail img, #detail-text b, #audit b").isEmpty(),
        "markup became elements");
    reason("checked with the depot");
    browser.find("#approve").click();
    browser.showing("#change-status", "approved");
    reason("the depot moved");
    browser.find("#retire").click();
    browser.showing("#change-status", "retired");
    browser.showing("#audit tbody", "the depot moved");
    assertEquals(4, browser.all("#audit tbody tr").size());
    String audit = browser.find("#audit tbody").getText();
    assertTrue(audit.contains("edited") && audit.contains("approved") && audit.contains("created")
        && audit.contains("plainer words") && audit.contains("manager-key"), audit);
    JsonNode stored = service.http().get("/api/v1/answers/" + id, Caller.AGENT).json()
        .get("answer");
    assertEquals("RETIRED", stored.get("state").asText());
    assertEquals(HOSTILE, stored.get("text").asText());
    assertEquals("undefined", browser.script("return typeof window.__pwned"));
  }

  @Test
  void aChangeOnAVersionSomeoneElseChangedIsRefusedWithTheServicesReason() {
    signIn("demo-manager-key");
    String id = open(1);
    int version = service.http().get("/api/v1/answers/" + id, Caller.AGENT).json().get("answer")
        .get("version").asInt();
    assertEquals(200, service.http().post("/api/v1/answers/" + id + "/approval",
        Map.of("version", version, "reason", "from another page"), Caller.MANAGER).status());
    reason("late approval");
    browser.find("#approve").click();
    browser.showing("#change-status", "someone changed it meanwhile");
  }

  @Test
  void agentsReadTheLibraryButSeeNoControlsToChangeIt() {
    signIn("demo-manager-key");
    open(3);
    reason("set aside for the agents' view");
    browser.find("#approve").click();
    browser.showing("#change-status", "approved");
    signIn("demo-agent-key");
    open(2);
    assertFalse(browser.find("#change-form").isDisplayed());
    int all = browser.all("#answers tbody tr").size();
    new Select(browser.find("#state")).selectByValue("drafted");
    browser.find("#search-button").click();
    // Only drafts are listed, and fewer than all: another test approved or retired some.
    browser.waiting().until(d -> {
      var states = browser.all("#answers tbody td.state");
      return states.size() < all && states.stream().allMatch(e -> e.getText().equals("drafted"));
    });
    browser.type("#search", "zzzz-nothing-matches");
    browser.find("#search-button").click();
    browser.showing("#list-status", "0 answers");
  }

  @Test
  void anAgentsProposedEditIsTakenIntoANewVersionByAManager() {
    signIn("demo-manager-key");
    var button = browser.all("#answers tbody tr button.link").get(4);
    String id = button.getAttribute("data-id");
    String proposed = "Put the bin out by seven on the morning of collection.";
    assertEquals(201, service.http().post("/api/v1/feedback", Map.of("question",
        "when do I put my bin out", "answerGroup", id, "verdict", "EDITED", "finalText", proposed,
        "propose", true), Caller.AGENT).status());
    assertEquals(400, service.http().post("/api/v1/feedback", Map.of("question",
        "when do I put my bin out", "answerGroup", id, "verdict", "ACCEPTED", "propose", true),
        Caller.AGENT).status());
    open(4);
    browser.showing("#detail-edits", "proposed it as the next version");
    browser.find("#detail-edits .use-proposal").click();
    assertEquals(proposed, browser.find("#edit-text").getDomProperty("value"));
    browser.find("#save").click();
    browser.showing("#change-status", "version 2");
    assertEquals(proposed, service.http().get("/api/v1/answers/" + id, Caller.AGENT).json()
        .get("answer").get("text").asText());
  }
}
