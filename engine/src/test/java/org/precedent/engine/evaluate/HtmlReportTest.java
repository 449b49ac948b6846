package org.precedent.engine.evaluate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

class HtmlReportTest {
  private static int count(String text, String needle) {
    Matcher m = Pattern.compile(Pattern.quote(needle)).matcher(text);
    int n = 0;
    while (m.find()) {
      n++;
    }
    return n;
  }

  private static String riskCoverageSection(String html) {
    int start = html.indexOf("<section id=\"risk-coverage\">");
    return html.substring(start, html.indexOf("</section>", start));
  }

  @Test
  void riskCoverageChartHasOneLinePerSystem() {
    EvaluationReport two = Fixtures.report("d", Fixtures.sixTickets("A"), Fixtures.sixTicketsImproved("B"));
    String chart = riskCoverageSection(HtmlReport.render(two, null));
    assertEquals(1, count(chart, "<svg"));
    assertEquals(2, count(chart, "<polyline"));
    String one = riskCoverageSection(HtmlReport.render(Fixtures.report("d", Fixtures.sixTickets("A")), null));
    assertEquals(1, count(one, "<polyline"));
  }

  @Test
  void riskCoverageLinePassesThroughEveryCurvePoint() {
    String chart = riskCoverageSection(HtmlReport.render(Fixtures.report("d", Fixtures.sixTickets("A")), null));
    Matcher points = Pattern.compile("<polyline[^>]* points=\"([^\"]*)\"").matcher(chart);
    assertTrue(points.find());
    // Six distinct confidences give six curve points (one per threshold).
    assertEquals(6, points.group(1).trim().split(" ").length);
  }

  @Test
  void hostileTextFromDataIsRenderedAsText() {
    SystemRun run = new SystemRun("<b>bold</b> & co", List.of(
        new EvaluatedTicket("t1", "<script>alert('x')</script>", true, 1, 0.9),
        new EvaluatedTicket("t2", "plain", true, 2, 0.3)));
    String html = HtmlReport.render(Fixtures.report("\"quoted\" <set>", run), null);
    assertFalse(html.contains("<script"), "no script element may come from data");
    assertTrue(html.contains("&lt;script&gt;alert(&#39;x&#39;)&lt;/script&gt;"));
    assertTrue(html.contains("&lt;b&gt;bold&lt;/b&gt; &amp; co"));
    assertFalse(html.contains("<b>bold</b>"));
    assertTrue(html.contains("&quot;quoted&quot; &lt;set&gt;"));
  }

  @Test
  void escapeHelperCoversTheFiveSpecialCharacters() {
    // The five characters the HTML Living Standard lets a text or attribute value break out with.
    assertEquals("&lt;a href=&quot;x&quot;&gt;Tom&#39;s &amp; Jerry&lt;/a&gt;",
        Html.escape("<a href=\"x\">Tom's & Jerry</a>"));
  }

  @Test
  void pageIsSelfContained() {
    String html = HtmlReport.render(Fixtures.report("d", Fixtures.sixTickets("A")), null);
    assertTrue(html.contains("<style>"));
    assertFalse(html.contains("<script"));
    assertFalse(html.contains("<link"));
    assertFalse(html.contains("src="));
    assertFalse(html.contains("href="));
    assertFalse(html.contains("@import"));
  }

  @Test
  void changesShowEarlierValueNewValueAndHandComputedDifference() {
    EvaluationReport before = Fixtures.report("d", Fixtures.sixTickets("A"));
    EvaluationReport after = Fixtures.report("d", Fixtures.sixTicketsImproved("A"));
    // By hand: top-1 goes from 2/5 to 3/5 when t2's right answer moves to rank 1: +20.0 points.
    Changes.Row top1 = Changes.rows(before, after).stream()
        .filter(r -> r.measure() == Measure.TOP1).findFirst().orElseThrow();
    assertEquals(0.2, top1.difference(), 1e-12);
    String html = HtmlReport.render(after, before);
    assertTrue(html.contains("Changes since the earlier report"));
    assertTrue(html.contains("<th scope=\"row\">Top-1 (= recall@1)</th><td>40.0%</td><td>60.0%</td>"
        + "<td class=\"better\">\u25B2 +20.0 pts"), "row: earlier, now, signed difference");
    // Brier, by hand: t2 now right, its term goes from 0.8^2 to 0.2^2, so (0.04 - 0.64) / 6 = -0.100,
    // and lower is better.
    assertTrue(html.contains("<td class=\"better\">\u25BC -0.100"));
    assertFalse(HtmlReport.render(after, null).contains("Changes since the earlier report"));
  }

  @Test
  void saysPlainlyWhenTooFewTicketsForAGuarantee() {
    String html = HtmlReport.render(Fixtures.report("d", Fixtures.sixTickets("A")), null);
    assertTrue(html.contains("Hand every ticket to a person: too few held-out tickets to guarantee 95.0% precision."));
    assertTrue(html.contains("at least 80 right answers above the threshold are needed"));
  }

  @Test
  void statesACertifiedThresholdInPlainWords() {
    EvaluationReport report = Fixtures.report("d", Fixtures.separable("S", "all"));
    var r = report.systems().get(0).recommendation();
    String html = HtmlReport.render(report, null);
    String expected = "Reply automatically when confidence \u2265 " + Html.thresholdUp(r.threshold()) + ": about "
        + Html.wholePercent(r.coverage()) + " of tickets answered, precision " + Html.percent(r.empiricalPrecision())
        + " (95% lower bound " + Html.percent(r.precisionLowerBound()) + ") on 300 held-out tickets.";
    assertTrue(html.contains(expected), expected);
  }

  @Test
  void bestValueOfEachRowIsEmphasised() {
    EvaluationReport two = Fixtures.report("d", Fixtures.sixTickets("A"), Fixtures.sixTicketsImproved("B"));
    String html = HtmlReport.render(two, null);
    // Top-1 40.0% against 60.0%: B's is the best.
    assertTrue(html.contains("<td>40.0%</td><td class=\"best\"><strong>60.0%</strong></td>"));
  }

  @Test
  void thresholdShownIsNeverBelowTheCertifiedOne() {
    assertEquals("0.8313", Html.thresholdUp(0.83121));
    assertEquals("0.8312", Html.thresholdUp(0.8312));
    assertEquals("1.0000", Html.thresholdUp(1.0));
  }

  @Test
  void footnoteSaysSensitiveQuestionsAreNeverAnsweredAutomatically() {
    String html = HtmlReport.render(Fixtures.report("d", Fixtures.sixTickets("A")), null);
    assertTrue(html.contains("never replies automatically to questions about safety, health, money or legal"));
  }
}
