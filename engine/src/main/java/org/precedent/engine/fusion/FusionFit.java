package org.precedent.engine.fusion;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.precedent.engine.candidates.CandidateScoring;
import org.precedent.engine.candidates.CandidateStages;
import org.precedent.knowledge.io.Progress;

/**
 * Fits fusion and calibration on questions kept apart from reranker training: each is asked as a
 * new question (a stored ticket leaving itself out of retrieval), its candidates scored, and each
 * candidate labelled right when it is the question's own answer group. Questions no group answers
 * (one-offs, out of scope) have no right candidate, so the fit learns to be unsure of them.
 */
public final class FusionFit {
  /** Validation figures that count questions rather than measure them: printed as integers. */
  private static final Set<String> COUNTS = Set.of("questions");

  private final FusionModel model;

  private FusionFit(FusionModel model) {
    this.model = model;
  }

  /** @param candidates the stages before fusion, as the pipeline will run them */
  public static FusionFit fit(CandidateStages candidates, List<FusionQuestion> fusionQuestions) {
    return fit(candidates, fusionQuestions, true);
  }

  /**
   * Fits only the systems that need no reranker (BM25, and with a dense leg the dense system and
   * fusion without the reranker), never asking the stages for reranker scores: the model a
   * version without a reranker holds.
   */
  public static FusionFit fitWithoutReranker(CandidateStages candidates,
      List<FusionQuestion> fusionQuestions) {
    return fit(candidates, fusionQuestions, false);
  }

  private static FusionFit fit(CandidateStages candidates, List<FusionQuestion> fusionQuestions,
      boolean reranker) {
    List<LabelledQuestion> questions = new ArrayList<>();
    Progress progress = new Progress("scoring the fusion split", "tickets", System.err)
        .total(fusionQuestions.size());
    for (FusionQuestion q : fusionQuestions) {
      String excluded = q.stored() ? q.ticketId() : null;
      CandidateScoring scoring = reranker ? candidates.score(q.question(), excluded)
          : candidates.retrieve(q.question(), excluded);
      questions.add(new LabelledQuestion(q.ticketId(), q.rightGroup(), scoring));
      progress.update(questions.size());
    }
    progress.finish(questions.size());
    List<SystemModel> systems = new ArrayList<>();
    Map<String, Map<String, Double>> validation = new LinkedHashMap<>();
    // The dense leg's features are learnt from when the source embedded the questions.
    boolean dense = questions.stream().anyMatch(q -> q.scoring().retrieval().vector() != null);
    for (ScoringSystem system : ScoringSystem.values()) {
      if (!system.fitted() || !system.applies(dense) || (!reranker && system.usesReranker())
          // Without the dense leg or the reranker, fusion without the reranker is BM25 again.
          || (!reranker && !dense && system == ScoringSystem.FUSED_WITHOUT_RERANKER)) {
        continue;
      }
      SystemFit fit = SystemFit.fit(system, dense, questions);
      systems.add(fit.model());
      validation.put(system.name(), fit.validation());
    }
    return new FusionFit(new FusionModel(systems, validation));
  }

  public void save(Path versionDir) throws IOException {
    model.save(versionDir);
  }

  public FusionModel model() {
    return model;
  }

  public String summary() {
    return summary(model);
  }

  /** A fitted model's validation figures, weights and calibration, in words. */
  public static String summary(FusionModel model) {
    StringBuilder s = new StringBuilder("fusion split, out of fold:");
    model.validation().forEach((system, figures) -> {
      s.append(String.format(Locale.ROOT, "%n  %-22s", system));
      figures.forEach((k, v) -> s.append(COUNTS.contains(k)
          ? String.format(Locale.ROOT, "  %s %,d", k, Math.round(v))
          : String.format(Locale.ROOT, "  %s %.3f", k, v)));
    });
    // The fullest system the model has: fused, else fused without the reranker, else BM25.
    List<ScoringSystem> fitted = model.fitted();
    SystemModel fused = model.system(fitted.get(fitted.size() - 1));
    s.append("\n" + fused.system().label() + " weights (original units):");
    double[] w = fused.model().weightsInOriginalUnits();
    for (int i = 0; i < w.length; i++) {
      s.append(String.format(Locale.ROOT, " %s %+.3f", fused.features().get(i), w[i]));
    }
    s.append(String.format(Locale.ROOT, "%nPlatt calibration of the %s logit: A %.3f, B %.3f",
        fused.system().label(), fused.calibration().a(), fused.calibration().b()));
    return s.toString();
  }

  /**
   * A question of the fusion split with its scored candidates.
   *
   * @param rightGroup the ticket's own answer group, or null for a one-off
   */
  record LabelledQuestion(String ticketId, String rightGroup, CandidateScoring scoring) {
    boolean isRight(int candidate) {
      return rightGroup != null
          && scoring.candidates().get(candidate).group().id().equals(rightGroup);
    }
  }
}
