package org.precedent.engine.figures;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Path;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import org.precedent.engine.fusion.ScoringSystem;
import org.precedent.engine.evaluate.EvaluationReport;
import org.precedent.engine.evaluate.Measures;
import org.precedent.engine.evaluate.SystemReport;
import org.precedent.engine.measure.ThresholdRecommendation;
import org.precedent.engine.rerank.TrainingMetrics;

/**
 * The figures of one measured run under the names {@link ExpectedFigures} uses, and the file they
 * are kept in ({@code figures.json}: {@code measuredWith} and {@code figures}, name to number or
 * null for an undefined figure).
 *
 * <p>Names: {@code SYSTEM.MEASURE} with SYSTEM {@code bm25}, {@code reranker} or {@code fused} and
 * MEASURE {@code top1}, {@code mrr}, {@code recall10}, {@code ece}, {@code brier}, {@code auroc},
 * {@code coverage95} (measured coverage at 95% precision), {@code threshold} (the guaranteed one),
 * {@code threshold_coverage}, {@code threshold_precision}, {@code threshold_lower_bound};
 * {@code heldout.tickets}, {@code heldout.in_scope}; {@code training.*} from the reranker's
 * training.
 *
 * @param measuredWith where and how the run was made
 * @param figures      name to value, NaN for an undefined figure
 */
public record MeasuredFigures(Map<String, String> measuredWith, Map<String, Double> figures) {

  public MeasuredFigures {
    measuredWith = Collections.unmodifiableMap(new LinkedHashMap<>(measuredWith));
    figures = Collections.unmodifiableMap(new LinkedHashMap<>(figures));
  }

  /** The figures of an evaluation report, each system's under its {@link ScoringSystem} name. */
  public static Map<String, Double> of(EvaluationReport report) {
    Map<String, Double> out = new LinkedHashMap<>();
    out.put("heldout.tickets", (double) report.tickets());
    out.put("heldout.in_scope", (double) report.inScopeTickets());
    for (SystemReport s : report.systems()) {
      String key = key(s.name());
      Measures m = s.measures();
      out.put(key + ".top1", m.top1());
      out.put(key + ".mrr", m.meanReciprocalRank());
      out.put(key + ".recall10", m.recallAt10());
      out.put(key + ".ece", m.expectedCalibrationError());
      out.put(key + ".brier", m.brierScore());
      out.put(key + ".auroc", m.auroc());
      out.put(key + ".coverage95", m.coverageAt95());
      out.put(key + ".reranker_runs", s.rerankerRuns());
      ThresholdRecommendation r = s.recommendation();
      boolean ok = r.repliesAutomatically();
      out.put(key + ".threshold", ok ? r.threshold() : Double.NaN);
      out.put(key + ".threshold_coverage", ok ? r.coverage() : Double.NaN);
      out.put(key + ".threshold_precision", ok ? r.empiricalPrecision() : Double.NaN);
      out.put(key + ".threshold_lower_bound", ok ? r.precisionLowerBound() : Double.NaN);
    }
    return out;
  }

  /** The reranker training's figures (wall-clock ones left out: they are not reproducible). */
  public static Map<String, Double> of(TrainingMetrics t) {
    Map<String, Double> out = new LinkedHashMap<>();
    out.put("training.pairs", (double) t.trainPairs());
    out.put("training.validation_pairs", (double) t.validationPairs());
    out.put("training.epochs", (double) t.epochs());
    out.put("training.validation_loss", t.validationLoss());
    out.put("training.anti_lm_lambda", t.antiLmLambda());
    out.put("training.validation_top1", t.validationTop1());
    out.put("training.vocabulary", (double) t.vocabularySize());
    return out;
  }

  private static String key(String systemName) {
    for (ScoringSystem s : ScoringSystem.values()) {
      if (s.label().equals(systemName)) {
        return s.name().toLowerCase(Locale.ROOT);
      }
    }
    throw new IllegalArgumentException("report holds an unknown system '" + systemName + "'");
  }

  public void save(Path file) throws IOException {
    ObjectNode root = FigureFiles.JSON.createObjectNode();
    ObjectNode with = root.putObject("measuredWith");
    measuredWith.forEach(with::put);
    ObjectNode values = root.putObject("figures");
    figures.forEach((name, v) -> {
      if (v == null || !Double.isFinite(v)) {
        values.putNull(name);
      } else {
        values.put(name, v);
      }
    });
    FigureFiles.write(file, root);
  }

  /** Reads {@link #save}'s file; null values come back as NaN. */
  public static MeasuredFigures load(Path file) throws IOException {
    JsonNode root = FigureFiles.read(file);
    if (root == null || !root.path("figures").isObject()) {
      throw new IOException(file + ": expected an object with a 'figures' object");
    }
    Map<String, String> with = FigureFiles.measuredWith(root);
    Map<String, Double> figures = new LinkedHashMap<>();
    var fields = root.get("figures").fields();
    while (fields.hasNext()) {
      var e = fields.next();
      if (e.getValue().isNull()) {
        figures.put(e.getKey(), Double.NaN);
      } else if (e.getValue().isNumber()) {
        figures.put(e.getKey(), e.getValue().asDouble());
      } else {
        throw new IOException(file + ": figures." + e.getKey() + " must be a number or null, was "
            + e.getValue());
      }
    }
    return new MeasuredFigures(with, figures);
  }
}
