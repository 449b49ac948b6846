package org.precedent.engine.evaluate;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import org.precedent.engine.decide.CandidateScoring;
import org.precedent.engine.decide.Ranked;
import org.precedent.engine.decide.Ranker;
import org.precedent.engine.decide.SafetyGate;
import org.precedent.engine.decide.ScoredCandidate;
import org.precedent.engine.decide.ScoringSystem;
import org.precedent.engine.rerank.Scorer;
import org.precedent.engine.safety.SafetyPolicy;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.retrieve.Retriever;

/**
 * Runs the three scoring systems over held-out questions, sharing one retrieval and one reranker
 * pass per question, and records for each system where the right answer ranked and how confident
 * the system was.
 */
public final class HeldOutRuns {
  private HeldOutRuns() {}

  /**
   * A held-out question and its truth.
   *
   * @param rightGroup the answer group that resolves it, or null when none does (out of scope)
   */
  public record HeldOutQuestion(String ticketId, String question, String category,
      String rightGroup) {}

  /** The model alone: no safety gate in front of any ticket. */
  public static List<SystemRun> run(Retriever retriever, Scorer scorer, Ranker ranker,
      List<HeldOutQuestion> questions, Progress progress) {
    return run(retriever, scorer, ranker, null, questions, progress);
  }

  /**
   * @param safety the policy whose gate the service puts before the threshold, so that each ticket
   *               records whether it would be handed off whatever the confidence; null for none
   */
  public static List<SystemRun> run(Retriever retriever, Scorer scorer, Ranker ranker,
      SafetyPolicy safety, List<HeldOutQuestion> questions, Progress progress) {
    Map<ScoringSystem, List<EvaluatedTicket>> bySystem = new EnumMap<>(ScoringSystem.class);
    for (ScoringSystem s : ScoringSystem.values()) {
      bySystem.put(s, new ArrayList<>());
    }
    progress.total(questions.size());
    int done = 0;
    for (HeldOutQuestion q : questions) {
      CandidateScoring scoring = CandidateScoring.of(retriever, scorer, q.question(), null);
      for (ScoringSystem s : ScoringSystem.values()) {
        Ranked ranked = ranker.rank(s, scoring.candidates(), scoring.scores());
        // Each system would send its own best answer, which the gate looks at too.
        boolean gated = safety != null && SafetyGate.handsOff(safety, q.question(), q.category(),
            ranked.candidates().isEmpty() ? null
                : ranked.candidates().get(0).candidate().group());
        bySystem.get(s).add(new EvaluatedTicket(q.ticketId(),
            q.category() == null ? "(none)" : q.category(), q.rightGroup() != null,
            rankOf(ranked.candidates(), q.rightGroup()), ranked.confidence(), gated));
      }
      progress.update(++done);
    }
    progress.finish(done);
    List<SystemRun> runs = new ArrayList<>();
    bySystem.forEach((s, tickets) -> runs.add(new SystemRun(s.label(), tickets)));
    return runs;
  }

  static int rankOf(List<ScoredCandidate> candidates, String rightGroup) {
    if (rightGroup == null) {
      return 0;
    }
    for (int i = 0; i < candidates.size(); i++) {
      if (candidates.get(i).candidate().group().id().equals(rightGroup)) {
        return i + 1;
      }
    }
    return 0;
  }
}
