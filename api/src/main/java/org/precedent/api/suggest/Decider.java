package org.precedent.api.suggest;

import io.micrometer.core.instrument.MeterRegistry;
import org.precedent.api.system.AdvisorLease;
import org.precedent.api.system.ModelHolder;
import org.precedent.engine.decide.Decision;
import org.springframework.stereotype.Component;

/** Decides questions on the model in force, and counts the outcomes for the metrics. */
@Component
public class Decider {
  private final ModelHolder models;
  private final MeterRegistry meters;

  Decider(ModelHolder models, MeterRegistry meters) {
    this.models = models;
    this.meters = meters;
  }

  /**
   * @param source who asked (suggestions, decisions, queue), a tag of the decision counter
   * @param limit  how many candidates the view keeps
   */
  public DecisionView decide(String question, String category, int limit, String source) {
    try (AdvisorLease lease = models.lease()) {
      Decision d = lease.advisor().decide(question, category);
      meters.counter("precedent.decisions", "source", source, "outcome", d.outcome().name())
          .increment();
      return DecisionView.of(d, lease.version(), limit);
    }
  }
}
