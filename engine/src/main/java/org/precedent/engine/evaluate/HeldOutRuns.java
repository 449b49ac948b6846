package org.precedent.engine.evaluate;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import org.precedent.engine.candidates.CandidateScoring;
import org.precedent.engine.decide.Pipeline;
import org.precedent.engine.fusion.Ranked;
import org.precedent.engine.fusion.ScoredCandidate;
import org.precedent.engine.fusion.ScoringSystem;
import org.precedent.knowledge.io.Progress;

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

  /** The model alone: no gate in front of any ticket. */
  public static List<SystemRun> modelAlone(Pipeline pipeline, List<HeldOutQuestion> questions,
      Progress progress) {
    return run(pipeline, false, questions, progress);
  }

  /**
   * As the service would decide: each ticket also records whether the gate before the threshold
   * (safety rules, people-only answers, incomplete answers) hands it off whatever the confidence.
   */
  public static List<SystemRun> asServed(Pipeline pipeline, List<HeldOutQuestion> questions,
      Progress progress) {
    return run(pipeline, true, questions, progress);
  }

  private static List<SystemRun> run(Pipeline pipeline, boolean gate,
      List<HeldOutQuestion> questions, Progress progress) {
    Map<ScoringSystem, List<EvaluatedTicket>> bySystem = new EnumMap<>(ScoringSystem.class);
    List<ScoringSystem> systems = pipeline.systems();
    for (ScoringSystem s : systems) {
      bySystem.put(s, new ArrayList<>());
    }
    progress.total(questions.size());
    int done = 0;
    for (HeldOutQuestion q : questions) {
      CandidateScoring scoring = pipeline.candidates(q.question(), null);
      for (ScoringSystem s : systems) {
        Ranked ranked = pipeline.rank(s, scoring);
        // Each system would send its own best answer, which the gate looks at too.
        boolean gated = gate && pipeline.gated(q.question(), q.category(),
            ranked.candidates().isEmpty() ? null
                : ranked.candidates().get(0).candidate().group());
        bySystem.get(s).add(new EvaluatedTicket(q.ticketId(),
            q.category() == null ? "(none)" : q.category(), q.rightGroup() != null,
            rankOf(ranked.candidates(), q.rightGroup()), ranked.confidence(), gated,
            ranked.candidates().isEmpty() ? null
                : ranked.candidates().get(0).candidate().group().id(),
            pipeline.reranks(s, scoring)));
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
