package org.precedent.engine.rerank.train;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Random;
import org.precedent.engine.rerank.AnswerScore;
import org.precedent.engine.rerank.RerankerModel;
import org.precedent.engine.rerank.Scorer;
import org.precedent.engine.rerank.TrainingPair;

/**
 * Chooses the anti-LM weight lambda (Li et al. 2016) on held-out pairs.
 *
 * <p>For each validation question the candidates are its own answer and up to
 * {@value #OTHER_CANDIDATES} other distinct answers of the data, drawn with the run's seed; lambda is
 * taken from 0, 0.1, .. 1 to maximise how often the question's own answer scores best. A tie goes to the
 * smaller lambda, the plainer model. At most {@value #MAX_QUESTIONS} questions are used to bound the
 * cost (each needs one forward pass); the pool size and question cap are this project's choices, not
 * from a published source.
 */
final class LambdaTuner {

  static final int OTHER_CANDIDATES = 19;
  static final int MAX_QUESTIONS = 200;

  record Choice(double lambda, double top1, int questions) {}

  private LambdaTuner() {}

  static Choice choose(RerankerModel model, List<TrainingPair> validation, List<TrainingPair> all, long seed) {
    List<String> pool = new ArrayList<>(new LinkedHashSet<>(all.stream().map(TrainingPair::answer).toList()));
    if (pool.size() < 2 || validation.isEmpty()) {
      return new Choice(0, Double.NaN, 0);
    }
    // With lambda = 1, antiLm = ll - lm, so each candidate's lm is recovered as ll - antiLm.
    Scorer scorer = new Scorer(model.withAntiLmLambda(1.0), 1);
    Random random = new Random(seed);
    List<TrainingPair> questions = new ArrayList<>(validation);
    Collections.shuffle(questions, random);
    questions = questions.subList(0, Math.min(MAX_QUESTIONS, questions.size()));
    int[] hits = new int[11];
    for (TrainingPair pair : questions) {
      List<String> candidates = candidates(pair.answer(), pool, random);
      List<AnswerScore> scores = scorer.score(pair.question(), candidates);
      for (int g = 0; g <= 10; g++) {
        double lambda = g / 10.0;
        if (ownAnswerWins(scores, lambda)) {
          hits[g]++;
        }
      }
    }
    int best = 0;
    for (int g = 1; g <= 10; g++) {
      if (hits[g] > hits[best]) {
        best = g;
      }
    }
    return new Choice(best / 10.0, hits[best] / (double) questions.size(), questions.size());
  }

  /** The right answer first, then others drawn without replacement. */
  private static List<String> candidates(String right, List<String> pool, Random random) {
    List<String> others = new ArrayList<>(pool);
    others.remove(right);
    Collections.shuffle(others, random);
    List<String> out = new ArrayList<>();
    out.add(right);
    out.addAll(others.subList(0, Math.min(OTHER_CANDIDATES, others.size())));
    return out;
  }

  /** The first candidate (the right one) strictly beats every other at this lambda. */
  private static boolean ownAnswerWins(List<AnswerScore> scores, double lambda) {
    double own = mix(scores.get(0), lambda);
    for (int i = 1; i < scores.size(); i++) {
      if (mix(scores.get(i), lambda) >= own) {
        return false;
      }
    }
    return true;
  }

  private static double mix(AnswerScore s, double lambda) {
    double lm = s.logLikelihood() - s.antiLm();
    return s.logLikelihood() - lambda * lm;
  }
}
