package org.precedent.api.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.math.BigDecimal;
import java.nio.file.Path;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.precedent.api.testing.TrainedData;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.decide.Thresholds;
import org.precedent.engine.measure.ThresholdDecimals;
import org.precedent.knowledge.store.DataDir;

/** What {@code ask} prints about how sure it is, on the trained demo model. */
class AskOutputTest {
  static final String QUESTION = "my green bin was not emptied on collection day";
  static final Pattern FIGURES = Pattern.compile(
      "HAND OFF \\(below threshold\\)  confidence ([0-9.]+) that the best answer is right, "
          + "threshold ([0-9.]+)");

  @Test
  void aConfidenceJustBelowTheThresholdPrintsBelowItAndIsTheOnlyChanceShown() throws Exception {
    Path data = TrainedData.copy();
    DataDir dir = new DataDir(data);
    double confidence;
    try (InForce active = InForce.open(dir)) {
      confidence = active.pipeline().decide(QUESTION, null).confidence();
    }
    // The shortest decimal a hair above the confidence: two decimals would print both as one.
    double threshold = ThresholdDecimals.shortestAbove(confidence, confidence + 0.0005);
    InForce.writeThresholds(dir, Thresholds.global(threshold));

    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int status = PrecedentCommand.run(new PrintWriter(out, true), new PrintWriter(err, true),
        "--data", data.toString(), "ask", QUESTION);
    assertEquals(0, status, err.toString());
    Matcher m = FIGURES.matcher(out.toString());
    assertTrue(m.find(), out.toString());
    assertEquals(ThresholdDecimals.of(threshold), m.group(2));
    assertTrue(new BigDecimal(m.group(1)).compareTo(new BigDecimal(m.group(2))) < 0,
        "confidence " + confidence + " printed as " + m.group(1) + ", threshold " + m.group(2));
    assertTrue(out.toString().contains("below the threshold " + m.group(2)), out.toString());
    // One chance per answer: the calibrated confidence, not a second per-candidate figure.
    assertFalse(out.toString().contains("P(right)"), out.toString());
    TrainedData.delete(data);
  }
}
