package org.precedent.engine.fusion;

import java.util.List;
import java.util.Objects;
import org.precedent.engine.stats.LogisticModel;
import org.precedent.engine.stats.PlattCalibrator;

/**
 * One scoring system's fitted parts: a logistic model of "this candidate is the right answer" over
 * the system's features, and the Platt calibration of its top candidate's logit.
 *
 * @param system      which system
 * @param model       P(candidate right | features), fitted on the fusion split
 * @param calibration maps the top candidate's logit to P(top candidate right), fitted out of fold
 */
public record SystemModel(ScoringSystem system, LogisticModel model, PlattCalibrator calibration) {
  public SystemModel {
    Objects.requireNonNull(system, "system");
    Objects.requireNonNull(model, "model");
    Objects.requireNonNull(calibration, "calibration");
    if (!model.featureNames().equals(system.features(false))
        && !model.featureNames().equals(system.features(true))) {
      throw new IllegalArgumentException("the " + system + " model was fitted on features "
          + model.featureNames() + ", expected " + system.features(false) + " or, with a dense "
          + "leg, " + system.features(true));
    }
  }

  /** Feature names, as the system was fitted on them. */
  public List<String> features() {
    return model.featureNames();
  }
}
