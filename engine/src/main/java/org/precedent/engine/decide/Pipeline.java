package org.precedent.engine.decide;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.precedent.engine.candidates.CandidateScoring;
import org.precedent.engine.explain.Explanation;
import org.precedent.engine.candidates.CandidateStages;
import org.precedent.engine.fusion.Ranked;
import org.precedent.engine.fusion.Ranker;
import org.precedent.engine.fusion.ScoredCandidate;
import org.precedent.engine.fusion.ScoringSystem;
import org.precedent.engine.measure.ThresholdDecimals;
import org.precedent.engine.safety.SafetyFinding;
import org.precedent.engine.safety.SafetyPolicy;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.group.AnswerGroup;

/**
 * The stages of a decision, in order: candidates for the question ({@link CandidateStages}: a
 * source, then a scorer), fusion into one ranking with a calibrated confidence ({@link Ranker}),
 * the gate of safety rules and incomplete answers ({@link SafetyGate}), and the threshold.
 * Safety comes before confidence: a question under a safety rule is handed off however sure the
 * model is. Made by {@link Assembly} only. Thread-safe.
 */
public final class Pipeline {
  private final CandidateStages candidates;
  private final Ranker ranker;
  private final SafetyPolicy safety;
  private final Thresholds thresholds;
  private final RerankerUse rerankerUse;
  private final List<ScoringSystem> systems;
  private final SlotFields slotFields;
  private final TextCleaner cleaner = TextCleaner.standard();

  Pipeline(CandidateStages candidates, Ranker ranker, SafetyPolicy safety, Thresholds thresholds,
      RerankerUse rerankerUse) {
    this(candidates, ranker, safety, thresholds, rerankerUse, SlotFields.NONE);
  }

  private Pipeline(CandidateStages candidates, Ranker ranker, SafetyPolicy safety,
      Thresholds thresholds, RerankerUse rerankerUse, SlotFields slotFields) {
    this.candidates = candidates;
    this.ranker = ranker;
    this.safety = safety;
    this.thresholds = thresholds;
    this.rerankerUse = rerankerUse;
    this.systems = ranker.systems().stream().filter(s -> switch (rerankerUse) {
      case ALWAYS -> s != ScoringSystem.CASCADE;
      case ON_DISAGREEMENT -> true;
      case NEVER -> !s.usesReranker();
    }).toList();
    this.slotFields = slotFields;
  }

  /** The same stages deciding with other thresholds. */
  public Pipeline withThresholds(Thresholds newThresholds) {
    return new Pipeline(candidates, ranker, safety, newThresholds, rerankerUse, slotFields);
  }

  /** The same stages, filling an answer's slots from the ticket's fields that {@code map} names. */
  public Pipeline withSlotFields(SlotFields map) {
    return new Pipeline(candidates, ranker, safety, thresholds, rerankerUse, map);
  }

  /** Which ticket field fills which slot. */
  public SlotFields slotFields() {
    return slotFields;
  }

  /**
   * Candidates and every score the pipeline's systems need for a cleaned question (stages one and
   * two): the reranker's unless it is never used.
   */
  public CandidateScoring candidates(String question, String excludedTicket) {
    return systems.stream().anyMatch(ScoringSystem::usesReranker)
        ? candidates.score(question, excludedTicket)
        : candidates.retrieve(question, excludedTicket);
  }

  /**
   * Whether ranking by {@code system} needs the reranker for these candidates: the reranker is
   * most of a decision's time, so the cascade runs it only where the faster legs disagree.
   */
  public boolean reranks(ScoringSystem system, CandidateScoring scoring) {
    return system == ScoringSystem.CASCADE ? !ranker.legsAgree(scoring) : system.usesReranker();
  }

  /** Whether the model version holds a reranker: a version trained without one never runs it. */
  public boolean hasReranker() {
    return ranker.hasReranker();
  }

  /** The system that decides: the last of {@link #systems()}. */
  public ScoringSystem decisionSystem() {
    return systems.get(systems.size() - 1);
  }

  /** Candidates in one system's order with its confidence (fusion and calibration). */
  public Ranked rank(ScoringSystem system, CandidateScoring scoring) {
    return ranker.rank(system, scoring);
  }

  /**
   * The scoring systems the model in force has and the reranker setting allows, for side-by-side
   * evaluation; the one that decides is last.
   */
  public List<ScoringSystem> systems() {
    return systems;
  }

  /**
   * Whether the gate hands the question off whatever the confidence, when {@code best} is the
   * answer that would be sent.
   */
  public boolean gated(String question, String category, AnswerGroup best) {
    return SafetyGate.handsOff(safety, question, category, best);
  }

  public Thresholds thresholds() {
    return thresholds;
  }

  /**
   * @param rawQuestion the customer's text as received
   * @param category    the ticket's category if known, else null
   */
  public Decision decide(String rawQuestion, String category) {
    return decideCleaned(cleaner.cleanQuestion(rawQuestion), category);
  }

  /**
   * @param question a question already cleaned and redacted (as ingest reads new tickets and the
   *                 queue stores them): cleaning it again could strip more, a second greeting say
   * @param category the ticket's category if known, else null
   */
  public Decision decideCleaned(String question, String category) {
    return decideCleaned(question, category, Map.of());
  }

  /**
   * @param fields the ticket's own fields, by name: an answer whose slots all have a field named
   *               for them ({@link SlotFields}) is sent with them filled in, else handed off
   */
  public Decision decideCleaned(String question, String category, Map<String, String> fields) {
    ScoringSystem system = decisionSystem();
    CandidateScoring scoring = candidates.retrieve(question, null);
    if (reranks(system, scoring)) {
      scoring = candidates.rerank(question, scoring);
    }
    Ranked ranked = rank(system, scoring);
    boolean truncated = scoring.truncated();
    double threshold = thresholds.forCategory(category);
    List<ScoredCandidate> candidates = ranked.candidates();
    AnswerGroup best = candidates.isEmpty() ? null : candidates.get(0).candidate().group();
    double confidence = ranked.confidence();

    List<Explanation> parts = new ArrayList<>();
    parts.add(ranker.explain(ranked));
    if (!candidates.isEmpty()) {
      parts.add(Explanation.fact("reranker", rerankerNote(system, scoring, rerankerUse)));
    }
    boolean ownThreshold = thresholds.own(category).isPresent();
    parts.add(Explanation.of("threshold", threshold, ownThreshold
        ? "the threshold for category '" + category + "'" : "the threshold for every category"));
    String groupId = best == null ? null : best.id();
    if (best != null) {
      parts.add(Explanation.of("evidence", best.size(), "past tickets that answer " + groupId
          + " resolved"));
    }

    Optional<SafetyFinding> finding = SafetyGate.check(safety, question, category, best);
    if (finding.isPresent()) {
      SafetyFinding f = finding.get();
      HandOffReason reason = f.kind() == SafetyFinding.Kind.TERM ? HandOffReason.SAFETY_RULE
          : HandOffReason.HUMAN_ONLY;
      parts.add(0, Explanation.fact("safety rule", f.topics().isEmpty() ? f.matched()
          : f.matched() + " (" + String.join(", ", f.topics()) + ")"));
      return new Decision(Outcome.HAND_OFF, reason, question, groupId, null, confidence,
          threshold, f, f.caution(), candidates, why(reason, confidence, explainSafety(f), parts),
          truncated);
    }
    if (best == null) {
      return new Decision(Outcome.HAND_OFF, HandOffReason.NO_CANDIDATE, question, null, null, 0,
          threshold, null, null, candidates, why(HandOffReason.NO_CANDIDATE, 0,
              "No past question shares a word with this one, so there is no answer to propose.",
              parts), truncated);
    }
    List<String> missing = SafetyGate.missingDetails(best);
    if (!missing.isEmpty()) {
      parts.add(0, Explanation.fact("missing details", String.join(", ", missing)));
      return new Decision(Outcome.HAND_OFF, HandOffReason.ANSWER_INCOMPLETE, question, groupId,
          null, confidence, threshold, null, null, candidates, why(HandOffReason.ANSWER_INCOMPLETE,
              confidence, "The best answer (" + groupId
              + ") lacks a detail that was redacted from the past replies ("
              + String.join(", ", missing) + "): a person should fill it in before it is sent.",
              parts), truncated);
    }
    List<String> slots = SafetyGate.slots(best);
    Optional<String> filled = slots.isEmpty() ? Optional.empty()
        : slotFields.fill(best.template(), fields);
    if (filled.isPresent()) {
      // Named by field, not by value: the customer's details stay in the reply alone.
      parts.add(0, Explanation.fact("slots filled", slotFields.fieldsFor(best.template())
          .entrySet().stream().map(e -> e.getKey() + " from field " + e.getValue())
          .collect(java.util.stream.Collectors.joining(", "))));
    }
    if (!slots.isEmpty() && filled.isEmpty()) {
      parts.add(0, Explanation.fact("answer template", best.template()));
      return new Decision(Outcome.HAND_OFF, HandOffReason.NEEDS_CUSTOMER_DETAILS, question,
          groupId, null, confidence, threshold, null, null, candidates,
          why(HandOffReason.NEEDS_CUSTOMER_DETAILS, confidence, "The best answer (" + groupId
              + ") differs between past customers in " + slots.size() + " place"
              + (slots.size() == 1 ? "" : "s") + " (" + String.join(", ", slots)
              + "): a person should fill in this customer's details: " + best.template(),
              parts), truncated);
    }
    if (confidence < threshold) {
      return new Decision(Outcome.HAND_OFF, HandOffReason.BELOW_THRESHOLD, question, groupId,
          null, confidence, threshold, null, null, candidates, why(HandOffReason.BELOW_THRESHOLD,
              confidence, String.format(Locale.ROOT, "The best answer (%s) has confidence %s, "
                  + "below the threshold %s: a person should check it.", groupId,
                  ThresholdDecimals.confidence(confidence, threshold),
                  ThresholdDecimals.of(threshold)), parts), truncated);
    }
    return new Decision(Outcome.REPLY, null, question, groupId, filled.orElse(best.canonical()),
        confidence, threshold, null, null, candidates, why(null, confidence,
            String.format(Locale.ROOT, "Answer %s%s has confidence %s, at or above the threshold "
                + "%s; it resolved %d past tickets.", groupId,
                filled.isPresent() ? ", its slots filled from the ticket's fields," : "", ThresholdDecimals.confidence(confidence, threshold),
            ThresholdDecimals.of(threshold), best.size()), parts), truncated);
  }

  private String rerankerNote(ScoringSystem system, CandidateScoring scoring,
      RerankerUse use) {
    if (!ranker.hasReranker()) {
      return "not run: this model version holds no reranker (trained without one); BM25"
          + (system == ScoringSystem.BM25 ? " alone decides" : ", the dense leg and their fusion decide");
    }
    if (system == ScoringSystem.CASCADE) {
      return scoring.reranked()
          ? "run: BM25, the dense leg and their fusion disagree on the first answer"
          : "not run: BM25, the dense leg and their fusion agree on the first answer";
    }
    if (!scoring.reranked()) {
      return "not run (-D" + RerankerUse.PROPERTY + "=" + RerankerUse.NEVER.setting() + ")";
    }
    return use == RerankerUse.ALWAYS ? "run for every question (-D" + RerankerUse.PROPERTY + "="
        + RerankerUse.ALWAYS.setting() + ")"
        : "run for every question: this model has no dense leg to agree or disagree with BM25";
  }

  /** The decision's explanation: its sentence at the root, what it rests on below. */
  private static Explanation why(HandOffReason reason, double confidence, String sentence,
      List<Explanation> parts) {
    return new Explanation(reason == null ? "reply" : "hand off: "
        + reason.name().toLowerCase(Locale.ROOT).replace('_', ' '), confidence, sentence, parts);
  }

  private static String explainSafety(SafetyFinding f) {
    return switch (f.kind()) {
      case TERM -> f.topics().size() == 1
          ? "The question mentions '" + f.matched() + "' (" + f.topic()
              + "): this always goes to a person."
          // Every matching topic is named, the most specific first, as the caution lists them.
          : "The question mentions '" + f.matched() + "' (" + f.topic() + "; also "
              + String.join(", ", f.topics().subList(1, f.topics().size()))
              + "): this always goes to a person.";
      case HUMAN_ONLY_CATEGORY -> "Category '" + f.matched() + "' is answered by people only.";
      case HUMAN_ONLY_GROUP -> "Answer " + f.matched() + " is marked to be sent by people only.";
    };
  }
}
