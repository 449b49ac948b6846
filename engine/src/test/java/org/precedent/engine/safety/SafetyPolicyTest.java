package org.precedent.engine.safety;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;

/** Human-only categories and groups, the order in which reasons are found, and what the policy refuses. */
class SafetyPolicyTest {

  private static SafetyPolicy demoLike() throws IOException {
    return PolicyFile.parse(List.of(
        "human-only-category = safety",
        "human-only-category = Legal",
        "human-only-group = a-1234abcd"), "test.rules");
  }

  @Test
  void humanOnlyCategoryHandsOffWithTheGeneralCaution() throws IOException {
    SafetyFinding f = demoLike().check("When is my bill due?", "safety", null).orElseThrow();
    assertEquals(SafetyFinding.Kind.HUMAN_ONLY_CATEGORY, f.kind());
    assertEquals("safety", f.matched());
    assertEquals(Cautions.general(), f.caution());
  }

  @Test
  void categoriesAreComparedWithoutRegardToCase() throws IOException {
    SafetyPolicy policy = demoLike();
    assertEquals(Set.of("safety", "legal"), policy.humanOnlyCategories());
    assertTrue(policy.check("When is my bill due?", "LEGAL", null).isPresent());
  }

  @Test
  void humanOnlyGroupHandsOff() throws IOException {
    SafetyFinding f = demoLike().check("When is my bill due?", "billing", "a-1234abcd").orElseThrow();
    assertEquals(SafetyFinding.Kind.HUMAN_ONLY_GROUP, f.kind());
    assertEquals("a-1234abcd", f.matched());
    assertEquals("human-only-group", f.ruleId());
  }

  @Test
  void aRoutineQuestionInAnOrdinaryCategoryAndGroupIsLeftToPrecedent() throws IOException {
    assertTrue(demoLike().check("When is my bill due?", "billing", "a-99999999").isEmpty());
  }

  @Test
  void aTermFindingComesBeforeTheCategoryBecauseItsCautionIsSpecific() throws IOException {
    SafetyFinding f = demoLike().check("I can smell gas in the hall", "safety", "a-1234abcd").orElseThrow();
    assertEquals(SafetyFinding.Kind.TERM, f.kind());
    assertEquals("gas", f.topic());
  }

  @Test
  void unknownCategoryAndGroupAreAllowed() {
    assertTrue(SafetyPolicy.defaults().check("burst main outside the school", null, null).isPresent());
    assertTrue(SafetyPolicy.defaults().check("How do I pay?", null, null).isEmpty());
  }

  @Test
  void aMissingQuestionIsRefused() {
    assertThrows(NullPointerException.class, () -> SafetyPolicy.defaults().check(null, "billing", null));
  }

  @Test
  void withHumanOnlyGroupsReplacesTheMarksAndLeavesTheOriginalAlone() throws IOException {
    SafetyPolicy original = demoLike();
    SafetyPolicy marked = original.withHumanOnlyGroups(Set.of("a-0000beef"));
    assertEquals(Set.of("a-0000beef"), marked.humanOnlyGroups());
    assertEquals(Set.of("a-1234abcd"), original.humanOnlyGroups());
    assertTrue(marked.check("When is my bill due?", null, "a-0000beef").isPresent());
    assertTrue(marked.check("When is my bill due?", null, "a-1234abcd").isEmpty());
    assertEquals(original.rules(), marked.rules());
    assertEquals(original.humanOnlyCategories(), marked.humanOnlyCategories());
  }

  @Test
  void aGroupIdWithSpacesIsRefused() {
    assertThrows(IllegalArgumentException.class,
        () -> SafetyPolicy.defaults().withHumanOnlyGroups(Set.of("two words")));
  }

  @Test
  void theRuleListCannotBeChangedFromOutside() {
    SafetyPolicy policy = SafetyPolicy.defaults();
    assertThrows(UnsupportedOperationException.class, () -> policy.rules().clear());
    assertThrows(UnsupportedOperationException.class, () -> policy.humanOnlyGroups().add("x"));
  }

  @Test
  void recordsRefuseIncompleteValues() {
    SafetyRule rule = SafetyPolicy.defaults().rules().get(0);
    assertThrows(IllegalArgumentException.class,
        () -> new SafetyRule("Bad Id", "sewage", SafetyRule.Specificity.SITUATION, rule.pattern(), rule.caution()));
    assertThrows(IllegalArgumentException.class,
        () -> new SafetyRule("ok", "sewage", SafetyRule.Specificity.SITUATION, rule.pattern(), " "));
    assertThrows(NullPointerException.class,
        () -> new SafetyRule("ok", "sewage", SafetyRule.Specificity.SITUATION, null, rule.caution()));
    assertThrows(NullPointerException.class,
        () -> new SafetyRule("ok", "sewage", null, rule.pattern(), rule.caution()));
    assertThrows(NullPointerException.class,
        () -> new SafetyFinding("ok", "sewage", "sewage coming", null, rule.caution()));
    assertThrows(IllegalArgumentException.class,
        () -> new SafetyFinding("ok", "sewage", "", SafetyFinding.Kind.TERM, rule.caution()));
  }
}
