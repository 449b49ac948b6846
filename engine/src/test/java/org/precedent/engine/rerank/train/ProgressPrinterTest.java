package org.precedent.engine.rerank.train;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import org.junit.jupiter.api.Test;
import org.precedent.engine.rerank.TrainingProgress;

class ProgressPrinterTest {

  @Test
  void printsTheFirstReportEpochEndsAndNothingInBetweenWithinTheInterval() {
    ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    ProgressPrinter printer = new ProgressPrinter(new PrintStream(bytes, true, StandardCharsets.UTF_8),
        Duration.ofHours(1));
    printer.accept(report(1, false));
    printer.accept(report(2, false));
    printer.accept(report(3, true));
    String[] lines = bytes.toString(StandardCharsets.UTF_8).split("\n");
    assertEquals(2, lines.length);
    assertEquals("reranker epoch 2/10 batch 1/40 loss 1.2346 val - tokens/s 1500 left <= 1:01:05", lines[0]);
    assertEquals("reranker epoch 2/10 batch 3/40 loss 1.2346 val - tokens/s 1500 left <= 1:01:05 (epoch done)",
        lines[1]);
  }

  private static TrainingProgress report(int batch, boolean end) {
    return new TrainingProgress(2, 10, batch, 40, 1.234567, Double.NaN, 1500.4, Duration.ofSeconds(3665), end);
  }
}
