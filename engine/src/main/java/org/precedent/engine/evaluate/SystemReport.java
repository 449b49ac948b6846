package org.precedent.engine.evaluate;

import java.util.List;
import java.util.Objects;
import org.precedent.engine.measure.ReliabilityBin;
import org.precedent.engine.measure.RiskCoveragePoint;
import org.precedent.engine.measure.ThresholdRecommendation;
import org.precedent.engine.measure.ThresholdRow;

/**
 * Everything the report holds about one system.
 *
 * @param name           the system's label
 * @param measures       headline measures
 * @param riskCoverage   the risk-coverage curve, thinned to at most
 *                       {@value EvaluationReports#MAX_CURVE_POINTS} points (first and last kept)
 * @param reliability    the {@value org.precedent.engine.measure.Calibration#DEFAULT_BINS} bins of
 *                       the reliability diagram, empty ones included
 * @param thresholds     one row per threshold 0.00, 0.01, ..., 1.00
 * @param recommendation the guaranteed threshold for the report's target precision
 * @param categories     per-category results
 * @param safetyHandOffs held-out tickets the safety gate hands to a person whatever the confidence
 * @param service        what the service would have done, the safety gate included, at every
 *                       threshold of {@code thresholds}, at every step of the risk-coverage curve
 *                       (named by its shortest decimal, thinned as the curve is) and at the
 *                       recommended threshold; ascending; empty in reports made before it was kept
 * @param rerankerRuns   the share of held-out tickets the system ran the reranker for: what it costs,
 *                       since the reranker is most of a decision's time (0 in older reports)
 */
public record SystemReport(
    String name,
    Measures measures,
    List<RiskCoveragePoint> riskCoverage,
    List<ReliabilityBin> reliability,
    List<ThresholdRow> thresholds,
    ThresholdRecommendation recommendation,
    CategoryTable categories,
    int safetyHandOffs,
    List<ServiceRow> service,
    double rerankerRuns) {
  public SystemReport {
    Objects.requireNonNull(name, "name");
    Objects.requireNonNull(measures, "measures");
    Objects.requireNonNull(recommendation, "recommendation");
    Objects.requireNonNull(categories, "categories");
    riskCoverage = List.copyOf(riskCoverage);
    reliability = List.copyOf(reliability);
    thresholds = List.copyOf(thresholds);
    service = service == null ? List.of() : List.copyOf(service);
  }
}
