package org.precedent.engine.measure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

class DiscriminationTest {

  private static JudgedAnswer a(double confidence, boolean correct) {
    return new JudgedAnswer(confidence, correct);
  }

  @Test
  void aurocMatchesFawcettsTwentyInstanceExample() {
    // Fawcett (2006), "An introduction to ROC analysis", Fig. 3: 20 instances (10 p, 10 n) with scores.
    // Table transcribed from memory. AUC hand-computed by counting, for each positive, the negatives
    // scored below it: 10+10+9+9+9+7+6+5+2+1 = 68 of 10*10 pairs, so AUC = 0.68.
    double[] score = {.9, .8, .7, .6, .55, .54, .53, .52, .51, .505,
                      .4, .39, .38, .37, .36, .35, .34, .33, .30, .1};
    String cls = "ppnpppnnpnpnpnnnpnpn";
    List<JudgedAnswer> answers = new ArrayList<>();
    for (int i = 0; i < score.length; i++) {
      answers.add(a(score[i], cls.charAt(i) == 'p'));
    }
    assertEquals(0.68, Discrimination.auroc(answers), 1e-12);
  }

  @Test
  void aurocCountsTiesAsHalfOnHanleyAndMcNeilsRatingData() {
    // Hanley and McNeil (1982), Radiology 143:29-36, Table 1 (from memory): CT images rated 1..5;
    // 58 normal with counts 33, 6, 6, 11, 2 and 51 abnormal with counts 3, 2, 2, 11, 33. The paper
    // reports area W = 0.893. Exact value with ties as 1/2, hand-computed: 2642 / (58 * 51).
    int[] normal = {33, 6, 6, 11, 2};
    int[] abnormal = {3, 2, 2, 11, 33};
    List<JudgedAnswer> answers = new ArrayList<>();
    for (int rating = 1; rating <= 5; rating++) {
      double confidence = rating / 5.0;
      for (int i = 0; i < normal[rating - 1]; i++) {
        answers.add(a(confidence, false));
      }
      for (int i = 0; i < abnormal[rating - 1]; i++) {
        answers.add(a(confidence, true));
      }
    }
    double auc = Discrimination.auroc(answers);
    assertEquals(0.893, auc, 5e-4);
    assertEquals(2642.0 / (58 * 51), auc, 1e-12);
  }

  @Test
  void aurocAgreesWithCountingEveryPairOnRandomTiedData() {
    // Definition (Hanley and McNeil 1982): P(right scores above wrong) + 1/2 P(tie), counted over all
    // pairs here, independently of the rank-sum route.
    Random random = new Random(7);
    List<JudgedAnswer> answers = new ArrayList<>();
    for (int i = 0; i < 300; i++) {
      double confidence = random.nextInt(21) / 20.0; // coarse grid: many ties
      answers.add(a(confidence, random.nextDouble() < 0.3 + 0.5 * confidence));
    }
    double wins = 0;
    long pairs = 0;
    for (JudgedAnswer r : answers) {
      for (JudgedAnswer w : answers) {
        if (r.correct() && !w.correct()) {
          pairs++;
          wins += r.confidence() > w.confidence() ? 1 : r.confidence() == w.confidence() ? 0.5 : 0;
        }
      }
    }
    assertEquals(wins / pairs, Discrimination.auroc(answers), 1e-12);
    Collections.shuffle(answers, random);
    assertEquals(wins / pairs, Discrimination.auroc(answers), 1e-12);
  }

  @Test
  void aurocIsUndefinedWhenOnlyOneKindOfAnswerIsPresent() {
    assertTrue(Double.isNaN(Discrimination.auroc(List.of(a(0.9, true), a(0.1, true)))));
    assertTrue(Double.isNaN(Discrimination.auroc(List.of(a(0.9, false), a(0.1, false)))));
  }

  @Test
  void aurocRejectsEmptyInput() {
    IllegalArgumentException e =
        assertThrows(IllegalArgumentException.class, () -> Discrimination.auroc(List.of()));
    assertTrue(e.getMessage().contains("AUROC"));
  }
}
