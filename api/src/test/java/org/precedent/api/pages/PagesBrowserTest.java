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
import org.precedent.engine.measure.ThresholdDecimals;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * The pages in a real headless Chromium against the real service: sign-in checks the credentials,
 * an agent asks and gives feedback, hostile text stays text, a manager moves the threshold (the
 * guaranteed one in one click) and applies it with a reason, with the safety gate counted.
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
    // A real evaluation on the demo's held-out tickets, as a manager would make one; at a target of
    // 90% the tiny test model gets a guaranteed threshold (at 95% it does not).
    int status = PrecedentCommand.run(new PrintWriter(out, true), new PrintWriter(err, true),
        "--data", data.toString(), "evaluate", demo.resolve("heldout.csv").toString(),
        "--mapping", demo.resolve("mapping.properties").toString(), "--target", "0.9");
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
    browser.go("/answers");
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
    browser.go("/answers");
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
    // One chance on the page: the decision's calibrated confidence, repeated beside the best
    // answer only.
    assertFalse(browser.find("#result").getText().contains("Chance it fits"));
    String figure = shownConfidence();
    assertTrue(browser.find("#suggestions > li:first-child .best-label").getText()
        .endsWith("confidence " + figure), browser.find("#suggestions > li:first-child").getText());
    assertTrue(browser.all("#suggestions > li:not(:first-child) .best-label").isEmpty());
    browser.screenshot(Path.of("/tmp/precedent-answers.png"));

    String accepted = suggestions.get(0).getDomAttribute("data-answer-group");
    suggestions.get(0).findElement(org.openqa.selenium.By.cssSelector(".accept")).click();
    browser.showing("#suggestions > li:first-child .status", "Recorded: accepted");
    JdbcTemplate db = service.bean(JdbcTemplate.class);
    Map<String, Object> row = db.queryForMap("SELECT agent, answer_group, verdict, final_text, "
        + "suggested_text FROM suggestion_feedback ORDER BY id DESC LIMIT 1");
    assertEquals("agent", row.get("AGENT"));
    assertEquals(accepted, row.get("ANSWER_GROUP"));
    assertEquals("ACCEPTED", row.get("VERDICT"));
    // The accepted text is kept as shown, for training to learn from what was sent.
    assertEquals(suggestions.get(0).findElement(org.openqa.selenium.By.cssSelector(".answer"))
        .getText().replaceAll("\\s+", " ").strip(),
        String.valueOf(row.get("SUGGESTED_TEXT")).replaceAll("\\s+", " ").strip());

    if (suggestions.size() > 1) {
      WebElement second = suggestions.get(1);
      second.findElement(org.openqa.selenium.By.cssSelector(".edit")).click();
      WebElement text = second.findElement(org.openqa.selenium.By.cssSelector(".final-text"));
      text.clear();
      text.sendKeys("We will send a crew to collect it tomorrow.");
      second.findElement(org.openqa.selenium.By.cssSelector(".propose")).click();
      second.findElement(org.openqa.selenium.By.cssSelector(".send-edit")).click();
      browser.showing("#suggestions > li:nth-child(2) .status", "Recorded: edited");
      browser.showing("#suggestions > li:nth-child(2) .status", "proposed to the library");
      Map<String, Object> edited = db.queryForMap("SELECT verdict, final_text, proposed "
          + "FROM suggestion_feedback ORDER BY id DESC LIMIT 1");
      assertEquals("EDITED", edited.get("VERDICT"));
      assertEquals(Boolean.TRUE, edited.get("PROPOSED"));
      assertEquals("We will send a crew to collect it tomorrow.", edited.get("FINAL_TEXT"));
    }
  }

  private static final java.util.regex.Pattern CONFIDENCE = java.util.regex.Pattern.compile(
      "Confidence ([0-9.]+)% that the best answer is right; ([0-9.]+)% needed");

  /** The confidence the decision box shows, as written ("98.2%"). */
  private String shownConfidence() {
    java.util.regex.Matcher m = CONFIDENCE.matcher(browser.find("#confidence").getText());
    assertTrue(m.find(), browser.find("#confidence").getText());
    return m.group(1) + "%";
  }

  @Test
  void aConfidenceJustBelowTheThresholdIsShownBelowItAndTheThresholdWithItsDigits() {
    String question = "My green bin was not emptied on collection day this week";
    double confidence = service.http().post("/api/v1/decisions", Map.of("question", question),
        Caller.AGENT).json().get("confidence").asDouble();
    // The shortest decimal a hair above the confidence: rounded to one decimal of a percentage,
    // both would read the same.
    double threshold = ThresholdDecimals.shortestAbove(confidence, confidence + 0.0005);
    JsonNode before = service.http().get("/api/v1/threshold", Caller.MANAGER).json();
    assertEquals(200, service.http().put("/api/v1/threshold", Map.of("global", threshold,
        "perCategory", Map.of(), "reason", "display check"), Caller.MANAGER).status());
    try {
      signInWithPassword("agent", "agent-demo-password");
      ask(question);
      java.util.regex.Matcher m = CONFIDENCE.matcher(browser.find("#confidence").getText());
      assertTrue(m.find(), browser.find("#confidence").getText());
      java.math.BigDecimal shownThreshold = new java.math.BigDecimal(m.group(2));
      // The threshold as a percentage keeps every digit: 0.9955 is 99.55%, not 99.6%.
      assertEquals(0, new java.math.BigDecimal(ThresholdDecimals.of(threshold)).movePointRight(2)
          .compareTo(shownThreshold), m.group(2) + " for " + threshold);
      assertTrue(new java.math.BigDecimal(m.group(1)).compareTo(shownThreshold) < 0,
          "confidence " + confidence + " shown as " + m.group(1) + "% against " + m.group(2) + "%");
      assertTrue(browser.find("#decision").getText().contains("below the threshold "
          + ThresholdDecimals.of(threshold)), browser.find("#decision").getText());
    } finally {
      service.http().put("/api/v1/threshold", Map.of("global", before.get("global").asDouble(),
          "perCategory", Map.of(), "reason", "display check done"), Caller.MANAGER);
    }
  }

  @Test
  void markupInAQuestionIsShownAsTextAndNeverRuns() {
    browser.go("/answers");
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
    browser.go("/answers");
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
    browser.screenshot(Path.of("/tmp/precedent-answers-safety.png"));
  }

  @Test
  void aWrongKeyIsRefusedAtSignInWithTheServicesReason() {
    signInWithKey("/answers", "not-a-key");
    browser.showing("#sign-in-status", "that API key is not known");
    assertTrue(browser.find("#sign-in-form").isDisplayed());
    assertFalse(browser.find("#question").isDisplayed(), "a wrong key opened the page");
    assertEquals("", browser.find("#who").getText());
    browser.screenshot(Path.of("/tmp/precedent-sign-in-refused.png"));

    browser.find("#method-password").click();
    browser.type("#user", "agent");
    browser.type("#password", "not-the-password");
    browser.find("#sign-in").click();
    browser.showing("#sign-in-status", "that user name and password do not match");
    assertFalse(browser.find("#question").isDisplayed());
  }

  @Test
  void anAgentOnTheThresholdPageIsToldInPlainWordsThatItIsForManagers() {
    signInWithKey("/manage", "demo-agent-key");
    WebElement notice = browser.visible("#other-role");
    assertTrue(notice.getText().contains("This page is for managers"), notice.getText());
    assertTrue(notice.getText().contains("agent role"), notice.getText());
    assertFalse(browser.find("#evaluation").isDisplayed());
    assertFalse(browser.find("#audit").isDisplayed(), "an empty table is shown");
    String page = browser.find("body").getText();
    assertFalse(page.contains("may not"), page);
    assertTrue(browser.find("#who").getText().contains("(agent)"), browser.find("#who").getText());
    browser.screenshot(Path.of("/tmp/precedent-manage-agent.png"));
    browser.find("#other-role .sign-out").click();
    browser.visible("#sign-in-form");
  }

  private static JsonNode fusedSystem() {
    JsonNode report = service.http().get("/api/v1/threshold/evaluation", Caller.MANAGER).json();
    return report.get("systems").get(report.get("systems").size() - 1);
  }

  private static int indexOf(JsonNode rows, double t) {
    int best = 0;
    for (int i = 0; i < rows.size(); i++) {
      if (Math.abs(rows.get(i).get("threshold").asDouble() - t)
          < Math.abs(rows.get(best).get("threshold").asDouble() - t)) {
        best = i;
      }
    }
    return best;
  }

  private void signInAsManager() {
    signInWithKey("/manage", "demo-manager-key");
    browser.visible("#curve");
  }

  private void signInWithKey(String page, String key) {
    browser.script("sessionStorage.clear()");
    browser.go(page);
    browser.visible("#api-key");
    browser.type("#api-key", key);
    browser.find("#sign-in").click();
  }

  private void assertFiguresOf(JsonNode row) {
    double t = row.get("threshold").asDouble();
    assertEquals(ThresholdDecimals.of(t), browser.find("#threshold-value").getText());
    assertEquals(percent(row.get("answeredShare").asDouble()),
        browser.find("#answered-share").getText());
    assertTrue(browser.find("#answered-count").getText().startsWith(row.get("answered").asInt()
        + " of "), browser.find("#answered-count").getText());
    assertEquals(String.format(Locale.ROOT, "%.1f", row.get("wrongPerThousand").asDouble()),
        browser.find("#wrong-per-thousand").getText());
    assertEquals(String.valueOf(row.get("safetyHandOffs").asInt()),
        browser.find("#safety-hand-offs").getText());
    assertEquals(ThresholdDecimals.of(t),
        browser.find("#curve .chosen").getDomAttribute("data-threshold"));
  }

  @Test
  void aManagerMovesTheThresholdSeesTheFiguresChangeAndAppliesItWithAReason() {
    signInAsManager();
    JsonNode rows = fusedSystem().get("service");
    double inForce = service.http().get("/api/v1/threshold", Caller.MANAGER).json().get("global")
        .asDouble();
    JsonNode shown = rows.get(indexOf(rows, inForce));
    assertFiguresOf(shown);

    // A threshold that answers a different number of the held-out tickets than the one in force;
    // of those, the one nearest to answering half of them, so that its mark stands apart.
    int other = -1;
    for (int i = 0; i < rows.size(); i++) {
      JsonNode r = rows.get(i);
      int answered = r.get("answered").asInt();
      if (answered != shown.get("answered").asInt() && answered > 0 && (other < 0
          || Math.abs(r.get("answeredShare").asDouble() - 0.5)
          < Math.abs(rows.get(other).get("answeredShare").asDouble() - 0.5))) {
        other = i;
      }
    }
    assertTrue(other >= 0, "every threshold answers the same tickets: " + rows);
    JsonNode row = rows.get(other);
    double t = row.get("threshold").asDouble();
    browser.script("const s = document.getElementById('threshold'); s.value = arguments[0];"
        + "s.dispatchEvent(new Event('input', {bubbles: true}));", String.valueOf(other));
    assertFiguresOf(row);
    assertEquals(percent(row.get("precision").asDouble()), browser.find("#precision").getText());
    assertEquals(percent(row.get("precisionLower").asDouble()) + " to "
        + percent(row.get("precisionUpper").asDouble()),
        browser.find("#precision-interval").getText());
    assertFalse(browser.all("#categories tbody tr").isEmpty(), "no category rows");

    browser.find("#apply").click();
    browser.showing("#apply-status", "reason is kept");
    assertEquals(inForce, service.http().get("/api/v1/threshold", Caller.MANAGER).json()
        .get("global").asDouble());

    String reason = "pilot: answer more routine bin questions <i>now</i>";
    browser.type("#reason", reason);
    browser.find("#apply").click();
    browser.showing("#apply-status", "Applied");
    browser.showing("#audit tbody tr:first-child", reason);
    assertTrue(browser.all("#audit i").isEmpty(), "markup in a reason became an element");
    String expected = "global=" + ThresholdDecimals.of(t, 4);
    assertTrue(browser.find("#audit tbody tr:first-child").getText().contains(expected),
        browser.find("#audit tbody tr:first-child").getText());
    assertEquals(t, service.http().get("/api/v1/threshold", Caller.MANAGER).json().get("global")
        .asDouble(), 0.0);
    assertNotEquals(inForce, t);
  }

  @Test
  void theGuaranteedThresholdIsMarkedAndChosenInOneClickWithTheDigitsItHas() {
    signInAsManager();
    JsonNode fused = fusedSystem();
    JsonNode recommendation = fused.get("recommendation");
    assertEquals("OK", recommendation.get("status").asText(), recommendation.toString());
    double guaranteed = recommendation.get("threshold").asDouble();
    String written = ThresholdDecimals.of(guaranteed);
    WebElement diamond = browser.find("#curve .recommended");
    assertEquals(written, diamond.getDomAttribute("data-threshold"));
    assertFalse(browser.all("#curve .in-force").isEmpty(), "the threshold in force is not marked");
    WebElement button = browser.find("#use-recommended");
    assertTrue(button.getText().contains(written), button.getText());
    button.click();
    JsonNode rows = fused.get("service");
    JsonNode row = rows.get(indexOf(rows, guaranteed));
    assertEquals(guaranteed, row.get("threshold").asDouble(), 0.0, "no row at the guaranteed "
        + "threshold");
    assertFiguresOf(row);
    assertEquals(written, browser.find("#curve .chosen").getDomAttribute("data-threshold"));
    assertTrue(browser.find("#apply").getText().endsWith(written), browser.find("#apply").getText());
  }

  @Test
  void theThresholdPageShowsCoverageWithAndWithoutTheApprovalGateAndWhatApprovingWouldAdd() {
    JsonNode report = service.http().get("/api/v1/threshold/evaluation", Caller.MANAGER).json();
    JsonNode fused = report.get("systems").get(report.get("systems").size() - 1);
    double guaranteed = fused.get("recommendation").get("threshold").asDouble();
    String at = "/api/v1/threshold/approval?threshold=" + guaranteed;
    JsonNode before = service.http().get(at, Caller.MANAGER).json();
    assertTrue(before.get("additions").size() >= 2, before.toString());
    // One held-back answer gets a hostile title, another is approved.
    String hostileId = before.get("additions").get(0).get("groupId").asText();
    String approvedId = before.get("additions").get(1).get("groupId").asText();
    String hostile = "<img src=x onerror=window.__pwned=1><b>bins</b> & \"collection\"";
    JsonNode answer = service.http().get("/api/v1/answers/" + hostileId, Caller.MANAGER).json()
        .get("answer");
    assertEquals(200, service.http().put("/api/v1/answers/" + hostileId, Map.of("version",
        answer.get("version").asInt(), "title", hostile, "text", answer.get("text").asText(),
        "reason", "a title with markup"), Caller.MANAGER).status());
    int version = service.http().get("/api/v1/answers/" + approvedId, Caller.MANAGER).json()
        .get("answer").get("version").asInt();
    assertEquals(200, service.http().post("/api/v1/answers/" + approvedId + "/approval",
        Map.of("version", version, "reason", "checked"), Caller.MANAGER).status());
    JsonNode approval = service.http().get(at, Caller.MANAGER).json();

    // Recounted here from the report's own outcomes (the fused system's answer per ticket):
    // without the gate every reply counts, with it only the approved answer's.
    int tickets = report.get("tickets").asInt();
    int replied = 0;
    int repliedApproved = 0;
    for (JsonNode o : report.get("outcomes")) {
      boolean sent = !o.get("safetyGate").asBoolean() && !o.get("answerGroup").isNull()
          && o.get("confidence").asDouble() >= guaranteed;
      replied += sent ? 1 : 0;
      repliedApproved += sent && o.get("answerGroup").asText().equals(approvedId) ? 1 : 0;
    }
    assertEquals(replied, approval.get("withoutGate").get("replied").asInt());
    assertEquals(repliedApproved, approval.get("withGate").get("replied").asInt());
    assertTrue(repliedApproved > 0 && repliedApproved < replied, approval.toString());
    // Without the gate the page's figure is the service row's at that threshold.
    JsonNode row = fused.get("service").get(indexOf(fused.get("service"), guaranteed));
    assertEquals(row.get("answered").asInt(), replied);

    signInAsManager();
    browser.find("#use-recommended").click();
    browser.showing("#approval-note", "At threshold " + ThresholdDecimals.of(guaranteed));
    browser.showing("#gate-on-coverage", percent((double) repliedApproved / tickets));
    assertEquals(percent((double) replied / tickets), browser.find("#gate-off-coverage").getText());
    assertEquals(browser.find("#answered-share").getText(),
        browser.find("#gate-off-coverage").getText());
    assertEquals(percent(approval.get("withGate").get("precision").asDouble()),
        browser.find("#gate-on-precision").getText());
    assertTrue(browser.find("#approval-gain").getText().startsWith("Approving these "
        + approval.get("additions").size() + " answers would add " + String.format(Locale.ROOT,
            "%.1f", approval.get("pointsAdded").asDouble()) + " points of coverage"),
        browser.find("#approval-gain").getText());
    List<WebElement> titles = browser.all("#approval-additions tbody th");
    assertEquals(approval.get("additions").size(), titles.size());
    assertTrue(titles.stream().anyMatch(t -> t.getText().equals(hostile)),
        titles.stream().map(WebElement::getText).toList().toString());
    assertTrue(browser.all("#approval-additions img, #approval-additions b").isEmpty());
    assertEquals("undefined", browser.script("return typeof window.__pwned"));
    browser.screenshot(Path.of("/tmp/precedent-manage-approval.png"));
  }

  @Test
  void theThresholdPageCountsWhatTheSafetyGateHandsOffAsHandedOff() {
    signInAsManager();
    JsonNode fused = fusedSystem();
    // The demo's held-out tickets include safety questions: the gate must hand some of them off.
    assertTrue(fused.get("safetyHandOffs").asInt() > 0, fused.get("safetyHandOffs").toString());
    JsonNode modelRows = fused.get("thresholds");
    JsonNode rows = fused.get("service");
    // At the grid's 0.50, the model alone answers the gated tickets too; the service does not, and
    // the difference is exactly what the gate handed off.
    JsonNode half = rows.get(indexOf(rows, 0.5));
    JsonNode halfModel = modelRows.get(50);
    assertEquals(0.5, half.get("threshold").asDouble(), 0.0);
    assertEquals(halfModel.get("answered").asInt(),
        half.get("answered").asInt() + half.get("safetyHandOffs").asInt());
    assertTrue(half.get("safetyHandOffs").asInt() > 0, half.toString());
    browser.script("const s = document.getElementById('threshold'); s.value = arguments[0];"
        + "s.dispatchEvent(new Event('input', {bubbles: true}));",
        String.valueOf(indexOf(rows, 0.5)));
    assertFiguresOf(half);
    assertTrue(browser.find("#safety-label").getText().contains(fused.get("safetyHandOffs").asInt()
        + " of "), browser.find("#safety-label").getText());

    // The category table: the safety category answers nothing automatically in service.
    for (JsonNode c : fused.get("categories").get("rows")) {
      WebElement tr = browser.find("#categories tbody tr:nth-child("
          + (indexIn(fused.get("categories").get("rows"), c) + 1) + ")");
      List<WebElement> cells = tr.findElements(org.openqa.selenium.By.cssSelector("td"));
      assertEquals(percent(c.get("serviceCoverage").asDouble()) + " (" + c.get("serviceAnswered")
          .asInt() + ")", cells.get(3).getText(), c.toString());
      assertEquals(String.valueOf(c.get("safetyHandOffs").asInt()), cells.get(5).getText());
      if (c.get("category").asText().equals("safety")) {
        assertEquals(0, c.get("serviceAnswered").asInt(), c.toString());
      }
    }
    browser.screenshot(Path.of("/tmp/precedent-manage.png"));
  }

  private static int indexIn(JsonNode array, JsonNode item) {
    for (int i = 0; i < array.size(); i++) {
      if (array.get(i).equals(item)) {
        return i;
      }
    }
    throw new AssertionError(item + " not in " + array);
  }

  @Test
  void withoutAnEvaluationTheManagerPageSaysHowToMakeOne() throws Exception {
    Path latest = service.data().resolve("reports").resolve("latest.json");
    Path aside = latest.resolveSibling("latest.json.aside");
    Files.move(latest, aside);
    try {
      signInWithKey("/manage", "demo-manager-key");
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
