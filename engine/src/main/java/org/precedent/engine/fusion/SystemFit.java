package org.precedent.engine.fusion;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.precedent.engine.fusion.Ranker;
import org.precedent.engine.fusion.ScoringSystem;
import org.precedent.engine.fusion.SystemModel;
import org.precedent.engine.stats.CrossFit;
import org.precedent.engine.stats.LogisticModel;
import org.precedent.engine.stats.LogisticRegression;
import org.precedent.engine.stats.PlattCalibrator;
import org.precedent.engine.stats.PlattScaling;
import org.precedent.engine.fusion.FusionFit.LabelledQuestion;
import org.precedent.engine.measure.Calibration;
import org.precedent.engine.measure.JudgedAnswer;

/**
 * Fits one scoring system: a logistic model over candidate rows (right answer or not), then Platt
 * scaling of the top candidate's logit, fitted on out-of-fold logits so that the calibration sees
 * the model as it behaves on questions it was not fitted on (5 folds by ticket).
 *
 * <p>Platt scaling rather than isotonic regression: the fusion split of a small team holds a few
 * hundred questions, and two parameters fitted on them generalise where a step function with one
 * step per block would overfit (Niculescu-Mizil and Caruana 2005 find isotonic regression
 * overfits below about a thousand calibration examples).
 */
record SystemFit(SystemModel model, Map<String, Double> validation) {
  private static final int FOLDS = 5;
  private static final long SEED = 20261201L;

  /** @param dense whether the candidates carry the dense leg's features to learn from */
  static SystemFit fit(ScoringSystem system, boolean dense, List<LabelledQuestion> questions) {
    List<String> features = system.features(dense);
    List<LabelledQuestion> usable = questions.stream()
        .filter(q -> !q.scoring().candidates().isEmpty()).toList();
    if (usable.size() < 2 * FOLDS) {
      throw new IllegalStateException("only " + usable.size() + " questions with candidates to "
          + "fit " + system.label() + " on; ingest more resolved tickets");
    }
    List<double[][]> rows = new ArrayList<>();
    for (LabelledQuestion q : usable) {
      rows.add(Ranker.features(features, q.scoring()));
    }
    int[] folds = CrossFit.folds(usable.stream().map(LabelledQuestion::ticketId).toList(), FOLDS,
        SEED);
    double[] oofLogit = new double[usable.size()];
    boolean[] topRight = new boolean[usable.size()];
    for (int f = 0; f < FOLDS; f++) {
      List<Integer> train = new ArrayList<>();
      for (int i = 0; i < usable.size(); i++) {
        if (folds[i] != f) {
          train.add(i);
        }
      }
      LogisticModel foldModel = fitRows(features, usable, rows, train);
      for (int i = 0; i < usable.size(); i++) {
        if (folds[i] == f) {
          int top = top(system, foldModel, rows.get(i), usable.get(i));
          oofLogit[i] = foldModel.logit(rows.get(i)[top]);
          topRight[i] = usable.get(i).isRight(top);
        }
      }
    }
    PlattCalibrator calibration = PlattScaling.fit(oofLogit, topRight);
    List<Integer> everyone = new ArrayList<>();
    for (int i = 0; i < usable.size(); i++) {
      everyone.add(i);
    }
    LogisticModel model = fitRows(features, usable, rows, everyone);

    List<JudgedAnswer> answers = new ArrayList<>();
    int inScope = 0;
    int inScopeRight = 0;
    for (int i = 0; i < usable.size(); i++) {
      answers.add(new JudgedAnswer(calibration.calibrate(oofLogit[i]), topRight[i]));
      if (usable.get(i).rightGroup() != null) {
        inScope++;
        inScopeRight += topRight[i] ? 1 : 0;
      }
    }
    Map<String, Double> validation = new LinkedHashMap<>();
    validation.put("questions", (double) usable.size());
    validation.put("top1_in_scope", inScope == 0 ? Double.NaN : inScopeRight / (double) inScope);
    validation.put("ece", Calibration.expectedCalibrationError(answers));
    validation.put("brier", Calibration.brierScore(answers));
    return new SystemFit(new SystemModel(system, model, calibration), validation);
  }

  private static LogisticModel fitRows(List<String> features, List<LabelledQuestion> questions,
      List<double[][]> rows, List<Integer> which) {
    List<double[]> x = new ArrayList<>();
    List<Boolean> y = new ArrayList<>();
    for (int i : which) {
      double[][] r = rows.get(i);
      for (int c = 0; c < r.length; c++) {
        x.add(r[c]);
        y.add(questions.get(i).isRight(c));
      }
    }
    boolean[] labels = new boolean[y.size()];
    for (int i = 0; i < labels.length; i++) {
      labels[i] = y.get(i);
    }
    return LogisticRegression.fit(features, x.toArray(new double[0][]), labels);
  }

  private static int top(ScoringSystem system, LogisticModel model, double[][] rows,
      LabelledQuestion q) {
    double[] logits = new double[rows.length];
    for (int c = 0; c < rows.length; c++) {
      logits[c] = model.logit(rows[c]);
    }
    return Ranker.order(system, logits, q.scoring().scores())[0];
  }
}
