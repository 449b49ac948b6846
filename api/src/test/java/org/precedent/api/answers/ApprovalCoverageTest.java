package org.precedent.api.answers;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.precedent.engine.evaluate.HeldOutOutcome;

/**
 * Coverage and precision with and without the approval gate on a worked example, counted by hand
 * (worked by hand, no source): eight held-out tickets at threshold 0.8 and a library of four
 * answers.
 */
class ApprovalCoverageTest {
  private static final List<HeldOutOutcome> OUTCOMES = List.of(
      new HeldOutOutcome("t1", "g1", 0.90, true, false),
      new HeldOutOutcome("t2", "g1", 0.85, false, false),
      new HeldOutOutcome("t3", "g2", 0.95, true, false),
      // handed off by the safety gate whatever its confidence
      new HeldOutOutcome("t4", "g3", 0.99, true, true),
      // below the threshold
      new HeldOutOutcome("t5", "g2", 0.50, true, false),
      // no candidate at all
      new HeldOutOutcome("t6", null, 0.90, false, false),
      new HeldOutOutcome("t7", "g4", 0.90, true, false),
      // a group the library does not hold
      new HeldOutOutcome("t8", "g5", 0.90, true, false));

  private static StoredAnswer answer(String group, String state, String title) {
    return new StoredAnswer(group, title, "Your bin is collected on the next round.", state, 1,
        false, "bins", List.of(), "Your bin is collected on the next round.", List.of(), false,
        true, 0, 0, 0, 0, "2026-01-01T00:00:00Z");
  }

  private static final List<StoredAnswer> LIBRARY = List.of(
      answer("g1", "DRAFTED", "bins: missed collection"), answer("g2", "APPROVED", "meter"),
      answer("g3", "DRAFTED", "water: brown"), answer("g4", "RETIRED", "old tariff"));

  @Test
  void withTheGateOnlyApprovedAnswersCountAndApprovingTheDraftedOneAddsItsTickets() {
    var r = ApprovalCoverage.of(OUTCOMES, 0.8, LIBRARY, true);
    // Without the gate: t1, t2, t3, t7, t8 replied (5 of 8), t2 wrong: 4 right.
    assertEquals(new ApprovalCoverage.Shares(8, 5, 4, 5 / 8.0, 4 / 5.0), r.withoutGate());
    // With it: only g2 (approved) is sent, t3.
    assertEquals(new ApprovalCoverage.Shares(8, 1, 1, 1 / 8.0, 1.0), r.withGate());
    // g1 is drafted and would answer t1 and t2; g4 is retired, g5 not in the library, g3 gated.
    assertEquals(List.of(new ApprovalCoverage.Addition("g1", "bins: missed collection", 2, 1,
        List.of("t1", "t2"))), r.additions());
    assertEquals(new ApprovalCoverage.Shares(8, 3, 2, 3 / 8.0, 2 / 3.0), r.afterApproving());
    assertEquals(25.0, r.pointsAdded(), 1e-9);
    assertEquals(1, r.approvedAnswers());
  }

  @Test
  void withoutRequiredApprovalDraftedAnswersAreSentButRetiredOnesNever() {
    var r = ApprovalCoverage.of(OUTCOMES, 0.8, LIBRARY, false);
    // t1, t2 (g1 drafted), t3 (g2), t8 (g5, no library answer to refuse it): 4 of 8; t7 retired.
    assertEquals(new ApprovalCoverage.Shares(8, 4, 3, 0.5, 0.75), r.withGate());
    assertEquals(List.of(), r.additions());
    assertEquals(0.0, r.pointsAdded(), 1e-9);
  }

  @Test
  void nothingRepliedHasNoPrecision() {
    var r = ApprovalCoverage.of(OUTCOMES, 1.0, LIBRARY, true);
    assertEquals(new ApprovalCoverage.Shares(8, 0, 0, 0.0, null), r.withoutGate());
  }
}
