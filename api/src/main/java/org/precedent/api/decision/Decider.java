package org.precedent.api.decision;

import io.micrometer.core.instrument.MeterRegistry;
import org.precedent.api.system.PipelineLease;
import org.precedent.api.system.InForceHolder;
import org.precedent.engine.decide.Decision;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.stereotype.Component;

/**
 * Decides questions on the model in force, and counts the outcomes for the metrics: the one door
 * through which the service's suggestions, decisions and queue reach the pipeline.
 */
@Component
public class Decider {
  private static final Logger LOG = LoggerFactory.getLogger(Decider.class);
  private final InForceHolder models;
  private final MeterRegistry meters;

  Decider(InForceHolder models, MeterRegistry meters) {
    this.models = models;
    this.meters = meters;
  }

  /**
   * Decides a question as a caller sent it: it is cleaned and redacted first.
   *
   * @param source who asked (suggestions, decisions, queue), a tag of the decision counter
   * @param limit  how many candidates the view keeps
   */
  public DecisionView decide(String question, String category, int limit, String source) {
    return decide(question, category, limit, source, false);
  }

  /**
   * Decides a question stored as cleaned (the queue cleans a ticket when it accepts it): cleaning
   * it again could strip more than the stored text shows, a second greeting say.
   */
  public DecisionView decideCleaned(String question, String category, int limit, String source) {
    return decideCleaned(question, category, java.util.Map.of(), limit, source);
  }

  /** The same, with the ticket's own fields, from which an answer's slots may be filled. */
  public DecisionView decideCleaned(String question, String category,
      java.util.Map<String, String> fields, int limit, String source) {
    return decide(question, category, fields, limit, source, true);
  }

  private DecisionView decide(String question, String category, int limit, String source,
      boolean cleaned) {
    return decide(question, category, java.util.Map.of(), limit, source, cleaned);
  }

  private DecisionView decide(String question, String category,
      java.util.Map<String, String> fields, int limit, String source, boolean cleaned) {
    try (PipelineLease lease = models.lease()) {
      Decision d = cleaned ? lease.pipeline().decideCleaned(question, category, fields)
          : lease.pipeline().decide(question, category);
      meters.counter("precedent.decisions", "source", source, "outcome", d.outcome().name())
          .increment();
      return DecisionView.of(d, lease.version(), limit);
    } catch (StackOverflowError e) {
      // The stack is unwound by now, so only this question is lost. Its trace would be a thousand
      // frames of one loop (a regular expression of a policy file, say): the top one says where.
      StackTraceElement[] at = e.getStackTrace();
      LOG.warn("a question of {} characters could not be decided: stack overflow at {}",
          question.length(), at.length > 0 ? at[0] : "an unknown place");
      meters.counter("precedent.decisions.failed", "source", source).increment();
      throw new Undecidable("this question could not be decided: reading its "
          + question.length() + " characters ran out of stack; a person must answer it");
    }
  }

  /** A question that cannot be decided at all; a person must take it. */
  public static final class Undecidable extends RuntimeException {
    Undecidable(String message) {
      // The message says all there is; a trace would only repeat where it was thrown.
      super(message, null, false, false);
    }
  }
}
