package org.precedent.api.pages;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.WebElement;
import org.precedent.api.cli.PrecedentCommand;
import org.precedent.api.testing.Browser;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.RunningService;
import org.precedent.api.testing.TrainedData;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * The pages in a real headless Chromium against the real service: an agent asks and gives
 * feedback, hostile text stays text, a manager moves the threshold and applies it with a reason.
 */
class PagesBrowserTest {
  static final String HOSTILE = "<script>window.__pwned=1</script><b>x</b> my green bin was not "
      + "emptied";
  static RunningService service;
  static Browser browser;

  @BeforeAll
  static void start() {
    browser = Browser.open("http://localhost:0"); // skips here when Chromium is absent
    browser.close();
    Path data = TrainedData.copy();
    Path demo = TrainedData.root().resolve("demo-data");
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    // A real evaluation on the demo's held-out tickets, as a manager would make one.
    int status = PrecedentCommand.run(new PrintWriter(out, true), new PrintWriter(err, true),
        "--data", data.toString(), "evaluate", demo.resolve("heldout.csv").toString(),
        "--mapping", demo.resolve("mapping.properties").toString());
    assertEquals(0, status, err.toString());
    service = RunningService.startOn(data);
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

  private void signInWithPassword(String user, String password) {
    browser.script("sessionStorage.clear()");
    browser.go("/desk");
    browser.visible("#sign-in-form");
    browser.find("#method-password").click();
    browser.type("#user", user);
    browser.type("#password", password);
    browser.find("#sign-in").click();
    browser.visible("#question");
  }

  private void ask(String question) {
    browser.type("#question", question);
    browser.find("#ask").click();
    browser.visible("#decision");
  }

  @Test
  void anAgentSeesRankedAnswersWithMarkedEvidenceAndTheirFeedbackIsStored() {
    browser.go("/desk");
    signInWithPassword("agent", "agent-demo-password");
    ask("My green bin was not emptied on collection day this week");
    List<WebElement> suggestions = browser.all("#suggestions > li");
    assertFalse(suggestions.isEmpty(), "no suggestion shown");
    assertTrue(browser.find("#outcome").getText().matches("(REPLY|HAND OFF): .*"),
        browser.find("#outcome").getText());
    WebElement mark = browser.find("#suggestions > li:first-child mark");
    assertFalse(mark.getText().isBlank(), "a marked span is empty");
    assertTrue(browser.find("#suggestions > li:first-child .evidence").getText().toLowerCase(
        Locale.ROOT).contains(mark.getText().toLowerCase(Locale.ROOT)));
    browser.screenshot(Path.of("/tmp/precedent-desk.png"));

    String accepted = suggestions.get(0).getDomAttribute("data-answer-group");
    suggestions.get(0).findElement(org.openqa.selenium.By.cssSelector(".accept")).click();
    browser.showing("#suggestions > li:first-child .status", "Recorded: accepted");
    JdbcTemplate db = service.bean(JdbcTemplate.class);
    Map<String, Object> row = db.queryForMap("SELECT agent, answer_group, verdict, final_text "
        + "FROM suggestion_feedback ORDER BY id DESC LIMIT 1");
    assertEquals("agent", row.get("AGENT"));
    assertEquals(accepted, row.get("ANSWER_GROUP"));
    assertEquals("ACCEPTED", row.get("VERDICT"));

    if (suggestions.size() > 1) {
      WebElement second = suggestions.get(1);
      second.findElement(org.openqa.selenium.By.cssSelector(".edit")).click();
      WebElement text = second.findElement(org.openqa.selenium.By.cssSelector(".final-text"));
      text.clear();
      text.sendKeys("We will send a crew to collect it tomorrow.");
      second.findElement(org.openqa.selenium.By.cssSelector(".send-edit")).click();
      browser.showing("#suggestions > li:nth-child(2) .status", "Recorded: edited");
      Map<String, Object> edited = db.queryForMap("SELECT verdict, final_text "
          + "FROM suggestion_feedback ORDER BY id DESC LIMIT 1");
      assertEquals("EDITED", edited.get("VERDICT"));
      assertEquals("We will send a crew to collect it tomorrow.", edited.get("FINAL_TEXT"));
    }
  }

  @Test
  void markupInAQuestionIsShownAsTextAndNeverRuns() {
    browser.go("/desk");
    signInWithPassword("agent", "agent-demo-password");
    browser.type("#question", HOSTILE);
    browser.find("#ask").click();
    browser.visible("#read-question");
    assertEquals("undefined", browser.script("return typeof window.__pwned"));
    assertTrue(browser.all("#result script, #result b").isEmpty(), "markup became elements");
    // Whatever cleaning keeps of the question is there as characters.
    String read = browser.find("#read-question").getText();
    assertTrue(read.contains("green bin"), read);
    String source = (String) browser.script("return document.getElementById('result').innerHTML");
    assertFalse(source.contains("<b>") || source.contains("<script"), source);
  }

  @Test
  void aSafetyQuestionIsHandedOffWithItsCautionInAMarkedBox() {
    browser.go("/desk");
    signInWithPassword("agent", "agent-demo-password");
    String question = "there is sewage in the river and dead fish";
    ask(question);
    JsonNode d = service.http().post("/api/v1/decisions", Map.of("question", question),
        Caller.AGENT).json();
    assertEquals("safety_rule", d.get("reason").asText(), d.toString());
    assertTrue(browser.find("#outcome").getText().startsWith("HAND OFF"));
    WebElement caution = browser.visible("#caution");
    assertEquals("alert", caution.getDomAttribute("role"));
    assertTrue(caution.getText().contains(d.get("caution").asText()), caution.getText());
    assertTrue(caution.getText().contains(d.get("safetyTopic").asText()), caution.getText());
    browser.screenshot(Path.of("/tmp/precedent-desk-safety.png"));
  }

  @Test
  void aWrongKeyReturnsToSignInWithTheServicesReason() {
    browser.script("sessionStorage.clear()");
    browser.go("/desk");
    browser.visible("#api-key");
    browser.type("#api-key", "not-a-key");
    browser.find("#sign-in").click();
    browser.type("#question", "is my water safe");
    browser.find("#ask").click();
    browser.showing("#sign-in-status", "not known");
    assertTrue(browser.find("#sign-in-form").isDisplayed());
  }

  @Test
  void aManagerMovesTheThresholdSeesTheFiguresChangeAndAppliesItWithAReason() {
    browser.script("sessionStorage.clear()");
    browser.go("/manage");
    browser.visible("#api-key");
    browser.type("#api-key", "demo-manager-key");
    browser.find("#sign-in").click();
    browser.visible("#curve");
    JsonNode report = service.http().get("/api/v1/threshold/evaluation", Caller.MANAGER).json();
    JsonNode rows = report.get("systems").get(report.get("systems").size() - 1).get("thresholds");
    double inForce = service.http().get("/api/v1/threshold", Caller.MANAGER).json().get("global")
        .asDouble();
    JsonNode shown = rows.get((int) Math.round(inForce * 100));
    assertEquals(percent(shown.get("answeredShare").asDouble()),
        browser.find("#answered-share").getText());

    // A threshold that answers a different number of the held-out tickets than the one in force;
    // of those, the one nearest to answering half of them, so that its mark stands apart.
    JsonNode other = null;
    for (JsonNode r : rows) {
      int answered = r.get("answered").asInt();
      if (answered != shown.get("answered").asInt() && answered > 0 && (other == null
          || Math.abs(r.get("answeredShare").asDouble() - 0.5)
          < Math.abs(other.get("answeredShare").asDouble() - 0.5))) {
        other = r;
      }
    }
    assertTrue(other != null, "every threshold answers the same tickets: " + rows);
    double t = other.get("threshold").asDouble();
    browser.script("const s = document.getElementById('threshold'); s.value = arguments[0];"
        + "s.dispatchEvent(new Event('input', {bubbles: true}));", String.format(Locale.ROOT,
        "%.2f", t));
    assertEquals(String.format(Locale.ROOT, "%.2f", t), browser.find("#threshold-value").getText());
    assertEquals(percent(other.get("answeredShare").asDouble()),
        browser.find("#answered-share").getText());
    assertEquals(percent(other.get("precision").asDouble()), browser.find("#precision").getText());
    assertEquals(percent(other.get("precisionLower").asDouble()) + " to "
        + percent(other.get("precisionUpper").asDouble()),
        browser.find("#precision-interval").getText());
    assertEquals(String.format(Locale.ROOT, "%.1f", other.get("wrongPerThousand").asDouble()),
        browser.find("#wrong-per-thousand").getText());
    assertEquals(String.format(Locale.ROOT, "%.2f", t),
        browser.find("#curve circle.chosen").getDomAttribute("data-threshold"));
    assertFalse(browser.all("#categories tbody tr").isEmpty(), "no category rows");

    browser.find("#apply").click();
    browser.showing("#apply-status", "reason is kept");
    assertEquals(inForce, service.http().get("/api/v1/threshold", Caller.MANAGER).json()
        .get("global").asDouble());

    String reason = "pilot: answer more routine bin questions <i>now</i>";
    browser.type("#reason", reason);
    browser.screenshot(Path.of("/tmp/precedent-manage.png"));
    browser.find("#apply").click();
    browser.showing("#apply-status", "Applied");
    browser.showing("#audit tbody tr:first-child", reason);
    assertTrue(browser.all("#audit i").isEmpty(), "markup in a reason became an element");
    String expected = String.format(Locale.ROOT, "global=%.4f", t);
    assertTrue(browser.find("#audit tbody tr:first-child").getText().contains(expected),
        browser.find("#audit tbody tr:first-child").getText());
    assertEquals(t, service.http().get("/api/v1/threshold", Caller.MANAGER).json().get("global")
        .asDouble(), 1e-9);
    assertNotEquals(inForce, t);
  }

  @Test
  void withoutAnEvaluationTheManagerPageSaysHowToMakeOne() throws Exception {
    Path latest = service.data().resolve("reports").resolve("latest.json");
    Path aside = latest.resolveSibling("latest.json.aside");
    Files.move(latest, aside);
    try {
      browser.script("sessionStorage.clear()");
      browser.go("/manage");
      browser.visible("#api-key");
      browser.type("#api-key", "demo-manager-key");
      browser.find("#sign-in").click();
      WebElement notice = browser.visible("#no-evaluation");
      assertTrue(notice.getText().contains("precedent evaluate FILE --apply"), notice.getText());
      assertFalse(browser.find("#evaluation").isDisplayed());
    } finally {
      Files.move(aside, latest);
    }
  }

  private static String percent(double v) {
    return String.format(Locale.ROOT, "%.1f%%", 100 * v);
  }
}
