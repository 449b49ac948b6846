package org.precedent.engine.decide;

import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.precedent.engine.measure.ThresholdDecimals;
import org.precedent.engine.rerank.Scorer;
import org.precedent.engine.safety.SafetyFinding;
import org.precedent.engine.safety.SafetyPolicy;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.group.AnswerGroup;
import org.precedent.knowledge.retrieve.Retriever;

/**
 * Decides, for one question, whether to reply automatically and with what: BM25 candidates, the
 * reranker's scores, the fused ranking and calibrated confidence, then the safety rules and the
 * threshold. Safety comes before confidence: a question under a safety rule is handed off however
 * sure the model is. Thread-safe.
 */
public final class Advisor {
  private final Retriever retriever;
  private final Scorer scorer;
  private final Ranker ranker;
  private final SafetyPolicy safety;
  private final Thresholds thresholds;
  private final TextCleaner cleaner = TextCleaner.standard();

  public Advisor(Retriever retriever, Scorer scorer, FusionModel fusion, SafetyPolicy safety,
      Thresholds thresholds) {
    this.retriever = retriever;
    this.scorer = scorer;
    this.ranker = new Ranker(fusion);
    this.safety = safety;
    this.thresholds = thresholds;
  }

  public Advisor withThresholds(Thresholds newThresholds) {
    return new Advisor(retriever, scorer, ranker.fusion(), safety, newThresholds);
  }

  /**
   * @param rawQuestion the customer's text as received
   * @param category    the ticket's category if known, else null
   */
  public Decision decide(String rawQuestion, String category) {
    String question = cleaner.cleanQuestion(rawQuestion);
    CandidateScoring scoring = CandidateScoring.of(retriever, scorer, question, null);
    Ranked ranked = ranker.rank(ScoringSystem.FUSED, scoring.candidates(), scoring.scores());
    boolean truncated = scoring.retrieval().truncated()
        || scoring.scores().stream().anyMatch(s -> s.questionTruncated());
    double threshold = thresholds.forCategory(category);
    List<ScoredCandidate> candidates = ranked.candidates();
    AnswerGroup best = candidates.isEmpty() ? null : candidates.get(0).candidate().group();
    double confidence = ranked.confidence();

    Optional<SafetyFinding> finding = SafetyGate.check(safety, question, category, best);
    String groupId = best == null ? null : best.id();
    if (finding.isPresent()) {
      SafetyFinding f = finding.get();
      HandOffReason reason = f.kind() == SafetyFinding.Kind.TERM ? HandOffReason.SAFETY_RULE
          : HandOffReason.HUMAN_ONLY;
      return new Decision(Outcome.HAND_OFF, reason, question, groupId, null, confidence,
          threshold, f, f.caution(), candidates, explainSafety(f), truncated);
    }
    if (best == null) {
      return new Decision(Outcome.HAND_OFF, HandOffReason.NO_CANDIDATE, question, null, null, 0,
          threshold, null, null, candidates,
          "No past question shares a word with this one, so there is no answer to propose.",
          truncated);
    }
    List<String> missing = SafetyGate.missingDetails(best);
    if (!missing.isEmpty()) {
      return new Decision(Outcome.HAND_OFF, HandOffReason.ANSWER_INCOMPLETE, question, groupId,
          null, confidence, threshold, null, null, candidates, "The best answer (" + groupId
              + ") lacks a detail that was redacted from the past replies ("
              + String.join(", ", missing) + "): a person should fill it in before it is sent.",
          truncated);
    }
    if (confidence < threshold) {
      return new Decision(Outcome.HAND_OFF, HandOffReason.BELOW_THRESHOLD, question, groupId,
          null, confidence, threshold, null, null, candidates, String.format(Locale.ROOT,
              "The best answer (%s) has confidence %s, below the threshold %s: a person "
                  + "should check it.", groupId, ThresholdDecimals.confidence(confidence, threshold),
              ThresholdDecimals.of(threshold)), truncated);
    }
    return new Decision(Outcome.REPLY, null, question, groupId, best.canonical(), confidence,
        threshold, null, null, candidates, String.format(Locale.ROOT,
            "Answer %s has confidence %s, at or above the threshold %s; it resolved %d past "
                + "tickets.", groupId, ThresholdDecimals.confidence(confidence, threshold),
            ThresholdDecimals.of(threshold), best.size()), truncated);
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
