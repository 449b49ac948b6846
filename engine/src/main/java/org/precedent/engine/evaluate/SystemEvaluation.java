package org.precedent.engine.evaluate;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.TreeSet;
import java.util.TreeMap;
import org.precedent.engine.measure.Calibration;
import org.precedent.engine.measure.Discrimination;
import org.precedent.engine.measure.GuaranteedThreshold;
import org.precedent.engine.measure.RankedOutcome;
import org.precedent.engine.measure.Ranking;
import org.precedent.engine.measure.RiskCoveragePoint;
import org.precedent.engine.measure.JudgedAnswer;
import org.precedent.engine.measure.SelectivePrediction;
import org.precedent.engine.measure.ThresholdDecimals;
import org.precedent.engine.measure.ThresholdRecommendation;
import org.precedent.engine.measure.ThresholdRow;
import org.precedent.engine.measure.ThresholdTable;

/**
 * Turns one system run into its part of the report. Ranking measures look at in-scope tickets only
 * (an out-of-scope ticket has nothing to rank); everything about confidence and thresholds looks at
 * all tickets, because a reply to an out-of-scope ticket reaches a customer too.
 */
final class SystemEvaluation {
  /** Thresholds of the full table: 0.00 to 1.00 in steps of 0.01. */
  static final List<Double> THRESHOLD_GRID = grid();

  private SystemEvaluation() {}

  static SystemReport of(SystemRun run, double targetPrecision, double delta, OptionalDouble given) {
    List<EvaluatedTicket> tickets = run.tickets();
    List<JudgedAnswer> scored = tickets.stream().map(EvaluatedTicket::scored).toList();
    List<RankedOutcome> ranked =
        tickets.stream().filter(EvaluatedTicket::inScope).map(EvaluatedTicket::ranked).toList();
    List<RiskCoveragePoint> curve = SelectivePrediction.riskCoverageCurve(scored);
    ThresholdRecommendation recommendation = GuaranteedThreshold.recommend(scored, targetPrecision, delta);
    return new SystemReport(run.name(), measures(scored, ranked),
        Curves.downsample(curve, EvaluationReports.MAX_CURVE_POINTS),
        Calibration.reliabilityDiagram(scored, Calibration.DEFAULT_BINS),
        ThresholdTable.rows(scored, THRESHOLD_GRID), recommendation,
        categories(tickets, categoryThreshold(recommendation, given, curve, targetPrecision)),
        (int) tickets.stream().filter(EvaluatedTicket::safetyGate).count(),
        service(tickets, serviceThresholds(curve, recommendation)),
        tickets.stream().filter(EvaluatedTicket::reranked).count() / (double) tickets.size());
  }

  /**
   * The thresholds a manager can choose between: the grid, each step of the risk-coverage curve by
   * its shortest name (thinned as the curve is), and the recommended threshold; ascending.
   */
  static List<Double> serviceThresholds(List<RiskCoveragePoint> curve,
      ThresholdRecommendation recommendation) {
    List<Double> steps = new ArrayList<>(curve.size());
    for (int i = 0; i < curve.size(); i++) {
      // The curve runs from the highest confidence down, so the next point is the next lower one.
      steps.add(ThresholdDecimals.naming(curve.get(i).threshold(), i + 1 < curve.size()
          ? curve.get(i + 1).threshold() : Double.NEGATIVE_INFINITY));
    }
    TreeSet<Double> all = new TreeSet<>(THRESHOLD_GRID);
    all.addAll(Curves.downsample(steps, EvaluationReports.MAX_CURVE_POINTS));
    if (recommendation.repliesAutomatically()) {
      all.add(recommendation.threshold());
    }
    return List.copyOf(all);
  }

  /** What the service would do at each threshold: the safety gate first, then the threshold. */
  static List<ServiceRow> service(List<EvaluatedTicket> tickets, List<Double> thresholds) {
    List<JudgedAnswer> open = tickets.stream().filter(t -> !t.safetyGate())
        .map(EvaluatedTicket::scored).toList();
    List<EvaluatedTicket> gated = tickets.stream().filter(EvaluatedTicket::safetyGate).toList();
    List<ThresholdRow> rows = ThresholdTable.rows(open, gated.size(), thresholds);
    List<ServiceRow> out = new ArrayList<>(rows.size());
    for (ThresholdRow r : rows) {
      int stopped = (int) gated.stream().filter(t -> t.confidence() >= r.threshold()).count();
      out.add(ServiceRow.of(r, stopped));
    }
    return List.copyOf(out);
  }

  static Measures measures(List<JudgedAnswer> scored, List<RankedOutcome> ranked) {
    boolean anyInScope = !ranked.isEmpty();
    return new Measures(
        anyInScope ? Ranking.top1Accuracy(ranked) : Double.NaN,
        anyInScope ? Ranking.meanReciprocalRank(ranked) : Double.NaN,
        anyInScope ? Ranking.recallAt(ranked, 1) : Double.NaN,
        anyInScope ? Ranking.recallAt(ranked, 5) : Double.NaN,
        anyInScope ? Ranking.recallAt(ranked, 10) : Double.NaN,
        anyInScope ? Ranking.recallAt(ranked, 20) : Double.NaN,
        Calibration.expectedCalibrationError(scored, Calibration.DEFAULT_BINS),
        Calibration.brierScore(scored),
        Discrimination.auroc(scored),
        SelectivePrediction.aurc(scored),
        SelectivePrediction.coverageAtPrecision(scored, 0.90),
        SelectivePrediction.coverageAtPrecision(scored, 0.95),
        SelectivePrediction.coverageAtPrecision(scored, 0.99));
  }

  /** A threshold and where it came from, for the per-category table. */
  record Chosen(double threshold, CategoryTable.Basis basis) {}

  static Chosen categoryThreshold(ThresholdRecommendation recommendation, OptionalDouble given,
      List<RiskCoveragePoint> curve, double targetPrecision) {
    if (recommendation.repliesAutomatically()) {
      return new Chosen(recommendation.threshold(), CategoryTable.Basis.RECOMMENDED);
    }
    if (given.isPresent()) {
      return new Chosen(given.getAsDouble(), CategoryTable.Basis.GIVEN);
    }
    // The lowest threshold (largest coverage) whose measured precision reaches the target; with none,
    // 1.0 answers only the fully confident, which is the closest a threshold gets to "none".
    double measured = 1.0;
    for (RiskCoveragePoint p : curve) {
      if (p.precision() >= targetPrecision) {
        measured = Math.min(measured, p.threshold());
      }
    }
    return new Chosen(measured, CategoryTable.Basis.MEASURED);
  }

  static CategoryTable categories(List<EvaluatedTicket> tickets, Chosen chosen) {
    Map<String, List<EvaluatedTicket>> byCategory = new TreeMap<>();
    for (EvaluatedTicket t : tickets) {
      byCategory.computeIfAbsent(t.category(), k -> new ArrayList<>()).add(t);
    }
    List<CategoryRow> rows = new ArrayList<>(byCategory.size());
    for (Map.Entry<String, List<EvaluatedTicket>> e : byCategory.entrySet()) {
      rows.add(categoryRow(e.getKey(), e.getValue(), chosen.threshold()));
    }
    return new CategoryTable(chosen.threshold(), chosen.basis(), rows);
  }

  private static CategoryRow categoryRow(String category, List<EvaluatedTicket> tickets, double threshold) {
    List<RankedOutcome> ranked =
        tickets.stream().filter(EvaluatedTicket::inScope).map(EvaluatedTicket::ranked).toList();
    double top1 = ranked.isEmpty() ? Double.NaN : Ranking.top1Accuracy(ranked);
    List<JudgedAnswer> scored = tickets.stream().map(EvaluatedTicket::scored).toList();
    ThresholdRow at = ThresholdTable.rows(scored, List.of(threshold)).get(0);
    ServiceRow served = service(tickets, List.of(threshold)).get(0);
    return new CategoryRow(category, tickets.size(), ranked.size(), top1, at.answered(), at.answeredShare(),
        at.precision(), served.answered(), served.answeredShare(), served.precision(),
        served.safetyHandOffs());
  }

  private static List<Double> grid() {
    List<Double> out = new ArrayList<>(101);
    for (int i = 0; i <= 100; i++) {
      // i / 100.0 rather than repeated += 0.01, which drifts and would miss 1.00 exactly.
      out.add(i / 100.0);
    }
    return List.copyOf(out);
  }
}
