package org.precedent.engine.safety;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Reading policy files: what each line does, and errors that name the file and the line. */
class PolicyFileTest {

  @TempDir
  Path dir;

  private Path write(String... lines) throws IOException {
    Path file = dir.resolve("safety.rules");
    Files.write(file, List.of(lines));
    return file;
  }

  private String loadError(String... lines) throws IOException {
    Path file = write(lines);
    return assertThrows(IOException.class, () -> SafetyPolicy.load(file)).getMessage();
  }

  @Test
  void readsSettingsRulesAndCautionsIgnoringCommentsAndBlankLines() throws IOException {
    SafetyPolicy policy = SafetyPolicy.load(write(
        "# a comment",
        "",
        "emergency-line = 01632 960999",
        "human-only-category = complaint",
        "human-only-group = a-1234abcd",
        "rule river | sewage | foam on the (river|brook)|dead fish",
        "include-defaults = true"));
    assertEquals("our emergency line on 01632 960999", policy.emergencyLine());
    assertEquals(java.util.Set.of("complaint"), policy.humanOnlyCategories());
    assertEquals(java.util.Set.of("a-1234abcd"), policy.humanOnlyGroups());
    assertEquals(SafetyPolicy.defaults().rules().size() + 1, policy.rules().size());
    SafetyFinding f = policy.check("Dead fish in the brook behind us", null, null).orElseThrow();
    assertEquals("river", f.ruleId());
    assertTrue(f.caution().contains("01632 960999"), f.caution());
  }

  @Test
  void aHumanOnlyCategoryHoldsWhateverCaseOrFormTheTicketWritesItIn() throws IOException {
    SafetyPolicy policy = SafetyPolicy.load(write(
        "include-defaults = false",
        "human-only-category = R\u00e9clamation"));
    // "e" + U+0301 is canonically equivalent to U+00E9 (Unicode Standard Annex #15).
    for (String written : List.of("r\u00e9clamation", " RE\u0301CLAMATION ", "R\u00e9clamation")) {
      SafetyFinding f = policy.check("where is my refund", written, null).orElseThrow(
          () -> new AssertionError("not held: " + written));
      assertEquals(SafetyFinding.Kind.HUMAN_ONLY_CATEGORY, f.kind());
    }
    assertTrue(policy.check("where is my refund", "reclamation", null).isEmpty());
  }

  @Test
  void withoutTheDefaultsOnlyTheFilesRulesApply() throws IOException {
    SafetyPolicy policy = SafetyPolicy.load(write(
        "include-defaults = false",
        "rule river | sewage | dead fish"));
    assertEquals(1, policy.rules().size());
    assertTrue(policy.check("I can smell gas", null, null).isEmpty());
  }

  @Test
  void aFileRuleReplacesTheBuiltInRuleOfTheSameIdInItsPlace() throws IOException {
    SafetyPolicy policy = SafetyPolicy.load(write("rule gas | gas | gas (leak|smell)|whiff of gas"));
    List<SafetyRule> defaults = SafetyPolicy.defaults().rules();
    assertEquals(defaults.size(), policy.rules().size());
    int at = defaults.stream().map(SafetyRule::id).toList().indexOf("gas");
    assertEquals("gas", policy.rules().get(at).id());
    assertTrue(policy.check("I can smell gas", null, null).isEmpty());
    assertTrue(policy.check("there's a whiff of gas", null, null).isPresent());
  }

  @Test
  void aCautionLineReplacesTheTopicsTextAndStillEndsWithTheClosing() throws IOException {
    SafetyPolicy policy = SafetyPolicy.load(write(
        "emergency-line = 01632 960999",
        "caution burst-main | Stay clear of the water and call {emergency-line}."));
    SafetyFinding f = policy.check("burst main on Weir Street", null, null).orElseThrow();
    assertEquals("Stay clear of the water and call our emergency line on 01632 960999. " + Cautions.CLOSING,
        f.caution());
  }

  @Test
  void theDemoPolicyFileLoads() throws IOException {
    Path demo = Path.of(System.getProperty("precedent.root", ".."), "demo-data", "safety.rules");
    SafetyPolicy policy = SafetyPolicy.load(demo);
    assertEquals("our emergency line on 01632 960999", policy.emergencyLine());
    assertTrue(policy.humanOnlyCategories().containsAll(List.of("safety", "legal", "complaint")));
    assertTrue(policy.rules().stream().allMatch(r -> r.caution().endsWith(Cautions.CLOSING)));
  }

  @Test
  void tradePacksChooseWhichBuiltInPacksJoinTheGeneralPart() throws IOException {
    SafetyPolicy water = SafetyPolicy.load(write("trade-packs = water-waste"));
    assertTrue(water.check("sewage coming up in the garden", null, null).isPresent());
    assertTrue(water.check("there's a power line down across the lane", null, null).isEmpty());
    assertTrue(water.check("my card was stolen", null, null).isPresent(), "the general part is always in");

    SafetyPolicy both = SafetyPolicy.load(write("trade-packs = energy, water-waste"));
    assertEquals(ids(SafetyPolicy.defaults()), ids(both), "both packs are what the defaults hold");

    SafetyPolicy none = SafetyPolicy.load(write("trade-packs = none"));
    assertTrue(none.check("sewage coming up in the garden", null, null).isEmpty());
    assertTrue(none.check("I can smell gas", null, null).isPresent());
    assertTrue(none.rules().stream().map(SafetyRule::id).noneMatch(id -> id.startsWith("wq-")
        || id.startsWith("energy-")));
  }

  @Test
  void withoutTradePacksAFileKeepsEveryPackAsTheDefaultsDo() throws IOException {
    assertEquals(ids(SafetyPolicy.defaults()), ids(SafetyPolicy.load(write("emergency-line = 1"))));
  }

  @Test
  void choosingPacksKeepsTheBuiltInOrder() throws IOException {
    List<String> all = ids(SafetyPolicy.defaults());
    List<String> water = ids(SafetyPolicy.load(write("trade-packs = water-waste")));
    assertEquals(all.stream().filter(water::contains).toList(), water);
  }

  @Test
  void anUnknownTradePackIsRefusedNamingTheKnownOnes() throws IOException {
    assertTrue(loadError("# x", "trade-packs = water-waste, telecoms")
        .endsWith("safety.rules:2: unknown trade pack 'telecoms'; known: energy, water-waste, or none"));
  }

  @Test
  void aTradePackNamedTwiceOrTradePacksGivenTwiceIsRefused() throws IOException {
    assertTrue(loadError("trade-packs = energy, energy").contains(":1: trade pack energy is named twice"));
    assertTrue(loadError("trade-packs = energy", "trade-packs = none").contains(":2: trade-packs is given twice"));
    assertTrue(loadError("trade-packs = energy,").contains(":1: unknown trade pack ''"));
  }

  @Test
  void tradePacksWithoutTheDefaultsIsRefusedAtItsLine() throws IOException {
    assertTrue(loadError("include-defaults = false", "trade-packs = energy", "rule a | sewage | x")
        .contains(":2: trade-packs chooses built-in rules, but include-defaults is false"));
  }

  @Test
  void aRuleMayDeclareItselfASignAndIsASituationOtherwise() throws IOException {
    SafetyPolicy policy = SafetyPolicy.load(write(
        "rule pong sign | water-quality | pong",
        "rule foam situation | sewage | foam",
        "rule fish | sewage | dead fish"));
    List<SafetyRule> rules = policy.rules();
    assertEquals(SafetyRule.Specificity.SIGN, find(rules, "pong").specificity());
    assertEquals(SafetyRule.Specificity.SITUATION, find(rules, "foam").specificity());
    assertEquals(SafetyRule.Specificity.SITUATION, find(rules, "fish").specificity());
  }

  @Test
  void aWrongSpecificityWordIsRefused() throws IOException {
    assertTrue(loadError("rule pong smell | water-quality | pong")
        .contains(":1: rule pong: specificity must be situation or sign, found: 'smell'"));
    assertTrue(loadError("rule pong sign extra | water-quality | pong")
        .contains(":1: rule id must be one word, optionally followed by situation or sign"));
  }

  private static List<String> ids(SafetyPolicy policy) {
    return policy.rules().stream().map(SafetyRule::id).toList();
  }

  private static SafetyRule find(List<SafetyRule> rules, String id) {
    return rules.stream().filter(r -> r.id().equals(id)).findFirst().orElseThrow();
  }

  @Test
  void theDemoPolicyChoosesTheWaterAndWastePackOnly() throws IOException {
    Path demo = Path.of(System.getProperty("precedent.root", ".."), "demo-data", "safety.rules");
    SafetyPolicy policy = SafetyPolicy.load(demo);
    List<String> ids = policy.rules().stream().map(SafetyRule::id).toList();
    assertTrue(ids.containsAll(List.of("sewage-flooding", "wq-off-taste", "lost-stolen-payment", "distress-self-harm",
        "tvww-river-pollution")), ids::toString);
    assertTrue(ids.stream().noneMatch(id -> id.startsWith("energy-")), ids::toString);
  }

  @Test
  void aBadPatternNamesTheFileTheLineAndTheRegexError() throws IOException {
    String message = loadError("# line 1", "", "rule broken | sewage | sewage (coming");
    assertTrue(message.startsWith(dir.resolve("safety.rules") + ":3: bad pattern for rule broken: "), message);
    assertTrue(message.contains("Unclosed group"), message);
  }

  @Test
  void anUnknownSettingNamesTheLine() throws IOException {
    assertTrue(loadError("emergency-line = 01632 960999", "human-only-queue = safety")
        .endsWith("safety.rules:2: unknown setting 'human-only-queue'"));
  }

  @Test
  void aLineThatIsNeitherSettingNorRuleIsRefused() throws IOException {
    assertTrue(loadError("sewage flooding").contains("safety.rules:1: expected"));
  }

  @Test
  void aRuleWithoutAPatternIsRefused() throws IOException {
    assertTrue(loadError("rule lonely | sewage").contains("safety.rules:1: expected 'rule <id> | <topic>"));
  }

  @Test
  void aRuleDefinedTwiceIsRefused() throws IOException {
    assertTrue(loadError("rule a | sewage | x", "rule a | sewage | y").contains(":2: rule a is defined twice"));
  }

  @Test
  void aBadRuleIdIsRefused() throws IOException {
    assertTrue(loadError("rule Big Leak | burst-main | x").contains(":1: rule id must be"));
  }

  @Test
  void aCautionForATopicNoRuleHasIsRefusedAtItsLine() throws IOException {
    assertTrue(loadError("include-defaults = false", "rule a | sewage | x", "caution sewerage | Keep away.")
        .contains(":3: caution for topic sewerage, but no rule has that topic"));
  }

  @Test
  void includeDefaultsMustBeTrueOrFalse() throws IOException {
    assertTrue(loadError("include-defaults = yes").contains(":1: include-defaults must be true or false"));
  }

  @Test
  void aSettingGivenTwiceIsRefused() throws IOException {
    assertTrue(loadError("emergency-line = 1", "emergency-line = 2").contains(":2: emergency-line is given twice"));
  }

  @Test
  void aCategoryOfTwoWordsIsRefused() throws IOException {
    assertTrue(loadError("human-only-category = health and safety").contains(":1: a category id is one word"));
  }
}
