package org.precedent.api.suggest;

import jakarta.validation.Valid;
import org.precedent.api.decision.Decider;
import org.precedent.api.decision.DecisionView;
import org.precedent.api.system.DecisionSlots;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ProblemDetail;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RestController;

/**
 * Ranked answers for agents, and reply-or-hand-off decisions for any caller; both are decided on
 * the decision slots, so an overloaded service answers 503 instead of queueing without end.
 */
@RestController
class SuggestController {
  private final Decider decider;
  private final DecisionSlots slots;

  SuggestController(Decider decider, DecisionSlots slots) {
    this.decider = decider;
    this.slots = slots;
  }

  /** Ranked suggested answers with their evidence (default 5), and the decision on the best. */
  @PostMapping(path = "/api/v1/suggestions", consumes = MediaType.APPLICATION_JSON_VALUE)
  DecisionView suggestions(@Valid @RequestBody QuestionRequest request) {
    return slots.run(() -> decider.decide(request.question(), request.categoryOrNull(),
        request.limitOr(5), "suggestions"));
  }

  /** Whether to reply automatically, with the reason, caution and candidates (default 3). */
  @PostMapping(path = "/api/v1/decisions", consumes = MediaType.APPLICATION_JSON_VALUE)
  DecisionView decision(@Valid @RequestBody QuestionRequest request) {
    return slots.run(() -> decider.decide(request.question(), request.categoryOrNull(),
        request.limitOr(3), "decisions"));
  }

  @ExceptionHandler(Decider.Undecidable.class)
  ProblemDetail undecidable(Decider.Undecidable e) {
    ProblemDetail p = ProblemDetail.forStatusAndDetail(HttpStatus.UNPROCESSABLE_ENTITY,
        e.getMessage());
    p.setTitle("Question cannot be decided");
    return p;
  }
}
