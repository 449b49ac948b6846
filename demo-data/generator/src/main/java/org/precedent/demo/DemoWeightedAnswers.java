package org.precedent.demo;

import java.util.List;
import java.util.Random;

/** Picks answers by weight, with seasonal weights precomputed for each month. */
final class DemoWeightedAnswers {
  private final List<DemoAnswer> answers;
  private final double[][] cumulative = new double[13][];

  DemoWeightedAnswers(List<DemoAnswer> answers) {
    this.answers = answers;
    for (int month = 1; month <= 12; month++) {
      double[] c = new double[answers.size()];
      double sum = 0;
      for (int i = 0; i < answers.size(); i++) {
        sum += answers.get(i).weight() * answers.get(i).season().factor(month);
        c[i] = sum;
      }
      cumulative[month] = c;
    }
  }

  DemoAnswer pick(int month, Random r) {
    double[] c = cumulative[month];
    double x = r.nextDouble() * c[c.length - 1];
    for (int i = 0; i < c.length; i++) {
      if (x < c[i]) {
        return answers.get(i);
      }
    }
    return answers.get(c.length - 1);
  }
}
