package org.precedent.engine.evaluate;

import java.util.function.ToDoubleFunction;

/** The measures shown side by side and compared with an earlier report, in display order. */
enum Measure {
  TOP1(Group.RANKING, "Top-1 (= recall@1)", Kind.PERCENT, true, s -> s.measures().top1()),
  MRR(Group.RANKING, "Mean reciprocal rank", Kind.DECIMAL, true, s -> s.measures().meanReciprocalRank()),
  RECALL5(Group.RANKING, "Recall@5", Kind.PERCENT, true, s -> s.measures().recallAt5()),
  RECALL10(Group.RANKING, "Recall@10", Kind.PERCENT, true, s -> s.measures().recallAt10()),
  RECALL20(Group.RANKING, "Recall@20", Kind.PERCENT, true, s -> s.measures().recallAt20()),
  ECE(Group.CONFIDENCE, "Expected calibration error (15 bins)", Kind.DECIMAL, false,
      s -> s.measures().expectedCalibrationError()),
  BRIER(Group.CONFIDENCE, "Brier score", Kind.DECIMAL, false, s -> s.measures().brierScore()),
  AUROC(Group.CONFIDENCE, "AUROC", Kind.DECIMAL, true, s -> s.measures().auroc()),
  AURC(Group.REPLIES, "Area under risk-coverage curve", Kind.DECIMAL, false, s -> s.measures().aurc()),
  COVERAGE90(Group.REPLIES, "Coverage at 90% precision", Kind.PERCENT, true, s -> s.measures().coverageAt90()),
  COVERAGE95(Group.REPLIES, "Coverage at 95% precision", Kind.PERCENT, true, s -> s.measures().coverageAt95()),
  COVERAGE99(Group.REPLIES, "Coverage at 99% precision", Kind.PERCENT, true, s -> s.measures().coverageAt99()),
  GUARANTEED(Group.REPLIES, "Coverage at the guaranteed threshold", Kind.PERCENT, true,
      s -> s.recommendation().coverage());

  /** Headings that split the side-by-side table. */
  enum Group {
    RANKING("Finding the right answer (in-scope tickets)"),
    CONFIDENCE("Confidence (all tickets)"),
    REPLIES("Automatic replies (all tickets)");

    final String heading;

    Group(String heading) {
      this.heading = heading;
    }
  }

  /** How a value and a difference are written. */
  enum Kind { PERCENT, DECIMAL }

  final Group group;
  final String label;
  final Kind kind;
  final boolean higherIsBetter;
  private final ToDoubleFunction<SystemReport> value;

  Measure(Group group, String label, Kind kind, boolean higherIsBetter, ToDoubleFunction<SystemReport> value) {
    this.group = group;
    this.label = label;
    this.kind = kind;
    this.higherIsBetter = higherIsBetter;
    this.value = value;
  }

  double of(SystemReport system) {
    return value.applyAsDouble(system);
  }

  String format(double v) {
    return kind == Kind.PERCENT ? Html.percent(v) : Html.decimal(v, 3);
  }

  /** A difference with its sign; percentages in percentage points, since a relative change would mislead. */
  String formatDifference(double d) {
    if (Double.isNaN(d)) {
      return Html.NOT_AVAILABLE;
    }
    return kind == Kind.PERCENT
        ? String.format(java.util.Locale.ROOT, "%+.1f pts", 100.0 * d)
        : String.format(java.util.Locale.ROOT, "%+.3f", d);
  }

  /** Whether {@code d} is zero at display precision, so "no change" is not shown with an arrow. */
  boolean negligible(double d) {
    return kind == Kind.PERCENT ? Math.abs(100.0 * d) < 0.05 : Math.abs(d) < 0.0005;
  }

  /** Whether {@code a} is better than {@code b}; NaN is never better. */
  boolean better(double a, double b) {
    if (Double.isNaN(a)) {
      return false;
    }
    if (Double.isNaN(b)) {
      return true;
    }
    return higherIsBetter ? a > b : a < b;
  }
}
