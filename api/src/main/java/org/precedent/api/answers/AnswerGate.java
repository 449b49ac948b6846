package org.precedent.api.answers;

import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;
import org.precedent.api.decision.DecisionView;
import org.precedent.api.system.InForceHolder;
import org.precedent.api.system.PipelineLease;
import org.precedent.engine.decide.HandOffReason;
import org.precedent.engine.decide.SlotFields;
import org.precedent.engine.explain.Explanation;
import org.precedent.knowledge.clean.Placeholders;
import org.precedent.knowledge.group.Slots;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.stereotype.Component;

/**
 * What the library lets the queue send: a reply the pipeline would send goes out only with an
 * answer a manager approved (while {@code precedent.answers.approval-required}, the default), in
 * the approved text; a retired answer never goes out. The pipeline's hand-offs stand as they are.
 */
@Component
public class AnswerGate {
  private static final Logger LOG = LoggerFactory.getLogger(AnswerGate.class);
  private final AnswerLibrary library;
  private final InForceHolder models;
  private final boolean approvalRequired;

  AnswerGate(AnswerLibrary library, InForceHolder models,
      @Value("${precedent.answers.approval-required:true}") boolean approvalRequired) {
    this.library = library;
    this.models = models;
    this.approvalRequired = approvalRequired;
  }

  public boolean approvalRequired() {
    return approvalRequired;
  }

  /** The decision the queue stores: {@code d} itself, or a hand-off the library calls for. */
  public DecisionView apply(DecisionView d) {
    return apply(d, Map.of());
  }

  /**
   * The same, for a ticket with its own fields: an approved text's slots are filled from them as
   * the pipeline fills a group's ({@code engine.decide.SlotFields}).
   */
  public DecisionView apply(DecisionView d, Map<String, String> fields) {
    if (!"REPLY".equals(d.outcome()) || d.answerGroup() == null) {
      return d;
    }
    try {
      library.syncIfNew(models.dataDir());
    } catch (IOException e) {
      // The library as last synced still says what was approved.
      LOG.warn("answer library not synced with the knowledge in force: {}", e.getMessage());
    }
    Optional<StoredAnswer> found = library.find(d.answerGroup());
    SlotFields slots;
    try (PipelineLease lease = models.lease()) {
      slots = lease.pipeline().slotFields();
    }
    Verdict v = verdict(found.orElse(null), approvalRequired, text -> slots.fill(text, fields));
    if (v.reason() == null) {
      library.recordUse(d.answerGroup());
      // No text of the library's own (approval not required, and not approved): the
      // pipeline's reply goes out as it made it.
      return v.text() == null || v.text().equals(d.reply()) ? d : withReply(d, v.text());
    }
    return handOff(d, v.reason(), v.detail());
  }

  /**
   * What the library says of an answer the pipeline would send.
   *
   * @param reason null when it may be sent, as {@code text}
   */
  record Verdict(HandOffReason reason, String detail, String text) {}

  static Verdict verdict(StoredAnswer a, boolean approvalRequired) {
    return verdict(a, approvalRequired, text -> Optional.empty());
  }

  /** @param fill the text with its slots filled from the ticket's fields, if they all can be */
  static Verdict verdict(StoredAnswer a, boolean approvalRequired,
      Function<String, Optional<String>> fill) {
    if (a != null && a.state().equals(StoredAnswer.State.RETIRED.name())) {
      return new Verdict(HandOffReason.ANSWER_RETIRED, "the answer " + a.groupId()
          + " is retired from the library: a person answers", null);
    }
    boolean approved = a != null && a.state().equals(StoredAnswer.State.APPROVED.name());
    if (!approved && approvalRequired) {
      return new Verdict(HandOffReason.ANSWER_NOT_APPROVED, "the answer "
          + (a == null ? "" : "'" + a.title() + "' ") + "is not approved in the library: "
          + "only approved answers are sent automatically", null);
    }
    if (!approved) {
      return new Verdict(null, null, null);
    }
    // An approved text edited by hand is checked as the pipeline checks a group's text.
    List<String> missing = Placeholders.in(a.text());
    if (!missing.isEmpty()) {
      return new Verdict(HandOffReason.ANSWER_INCOMPLETE, "the approved text still holds "
          + String.join(", ", missing) + ": a person fills it in", null);
    }
    List<String> slots = Slots.names(a.text());
    if (!slots.isEmpty()) {
      Optional<String> filled = fill.apply(a.text());
      if (filled.isPresent()) {
        return new Verdict(null, null, filled.get());
      }
      return new Verdict(HandOffReason.NEEDS_CUSTOMER_DETAILS, "the approved text has slots "
          + String.join(", ", slots) + " for this customer's details", null);
    }
    return new Verdict(null, null, a.text());
  }

  private static DecisionView withReply(DecisionView d, String text) {
    return new DecisionView(d.outcome(), d.reason(), d.question(), d.answerGroup(), text,
        d.confidence(), d.threshold(), d.caution(), d.safetyTopic(), d.explanation(), d.why(),
        d.truncated(), d.modelVersion(), d.candidates(), d.template());
  }

  private static DecisionView handOff(DecisionView d, HandOffReason reason, String detail) {
    String sentence = "Handed off: " + detail + ".";
    List<Explanation> parts = new ArrayList<>();
    parts.add(Explanation.fact("library", detail));
    if (d.why() != null) {
      parts.add(d.why());
    }
    // The root as the pipeline names its own: the outcome, the confidence, the sentence.
    Explanation why = new Explanation("hand off: "
        + reason.name().toLowerCase(Locale.ROOT).replace('_', ' '), d.confidence(), sentence,
        parts);
    return new DecisionView("HAND_OFF", reason.name().toLowerCase(Locale.ROOT), d.question(),
        d.answerGroup(), null, d.confidence(), d.threshold(), d.caution(), d.safetyTopic(),
        sentence, why, d.truncated(), d.modelVersion(), d.candidates(), d.template());
  }
}
