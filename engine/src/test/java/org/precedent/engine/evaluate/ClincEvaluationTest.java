package org.precedent.engine.evaluate;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;

import java.io.IOException;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.precedent.knowledge.datasets.Clinc150;

class ClincEvaluationTest {

  @Test
  void oneDomainIsItsIntentsWithEveryOutOfScopeQuery() throws IOException {
    // Larson et al. 2019, section 3: per intent 100 train, 20 validation, 30 test queries;
    // out-of-scope 100 validation and 1,000 test queries, all kept when one domain is run.
    ClincEvaluation banking = ClincEvaluation.of(Clinc150.load(), "banking");
    assertEquals("banking", banking.scope());
    assertEquals(1_500, banking.train().size());
    assertEquals(300 + 100, banking.validation().size());
    assertEquals(450 + 1_000, banking.test().size());
    assertNull(banking.test().get(banking.test().size() - 1).rightGroup());
    assertEquals(banking.train().get(0).label(), banking.train().get(0).reply().replace(' ', '_'));
  }

  @Test
  void theTunedThresholdWeighsInScopeAccuracyAndOutOfScopeRecallEqually() {
    // Worked by hand: two in-scope tickets right at 0.9 and 0.6, one wrong at 0.8, and two
    // out-of-scope at 0.7 and 0.3. At t = 0.65: in-scope 1/3 right and answered, out-of-scope
    // 1/2 held back; at t = 0.705 (first grid step above 0.7): 1/3 and 2/2; at t <= 0.3: 2/3 and 0.
    List<EvaluatedTicket> tickets = List.of(
        new EvaluatedTicket("a", "c", true, 1, 0.9), new EvaluatedTicket("b", "c", true, 1, 0.6),
        new EvaluatedTicket("c", "c", true, 2, 0.8), new EvaluatedTicket("d", "c", false, 0, 0.7),
        new EvaluatedTicket("e", "c", false, 0, 0.3));
    assertArrayEquals(new double[] {1 / 3.0, 0.5}, ClincEvaluation.atThreshold(tickets, 0.65), 1e-12);
    assertArrayEquals(new double[] {2 / 3.0, 0.5}, ClincEvaluation.atThreshold(tickets, 0.6), 1e-12);
    // Best sum 1/3 + 1 = 1.333 first reached on the grid at 0.705; 2/3 + 1/2 = 1.167 is lower.
    assertEquals(0.705, ClincEvaluation.bestThreshold(tickets), 1e-12);
    // Top-1 with no threshold counts in-scope tickets only (Larson et al. 2019 report in-scope
    // accuracy over in-scope queries): 2 of the 3 rank the right answer first.
    assertEquals(2 / 3.0, ClincEvaluation.inScopeTop1(tickets), 1e-12);
  }
}
