package org.precedent.engine.rerank.train;

import java.io.PrintStream;
import java.time.Duration;
import java.util.Locale;
import java.util.function.Consumer;
import org.precedent.engine.rerank.TrainingProgress;

/** Prints a progress line at most every few seconds, and always at the end of an epoch. */
public final class ProgressPrinter implements Consumer<TrainingProgress> {

  private final PrintStream out;
  private final long intervalNanos;
  private long lastPrinted = Long.MIN_VALUE;

  public ProgressPrinter(PrintStream out, Duration interval) {
    this.out = out;
    this.intervalNanos = interval.toNanos();
  }

  /** To standard error every 5 seconds: often enough to see it move, rarely enough to read. */
  public static ProgressPrinter toStandardError() {
    return new ProgressPrinter(System.err, Duration.ofSeconds(5));
  }

  @Override
  public void accept(TrainingProgress p) {
    long now = System.nanoTime();
    if (!p.epochEnd() && lastPrinted != Long.MIN_VALUE && now - lastPrinted < intervalNanos) {
      return;
    }
    lastPrinted = now;
    out.println(format(p));
  }

  static String format(TrainingProgress p) {
    long s = p.timeLeft().toSeconds();
    return String.format(Locale.ROOT, "reranker epoch %d/%d batch %d/%d loss %.4f val %s tokens/s %.0f left <= %d:%02d:%02d%s",
        p.epoch(), p.maxEpochs(), p.batch(), p.batchesPerEpoch(), p.trainLoss(),
        Double.isNaN(p.validationLoss()) ? "-" : String.format(Locale.ROOT, "%.4f", p.validationLoss()),
        p.tokensPerSecond(), s / 3600, (s / 60) % 60, s % 60, p.epochEnd() ? " (epoch done)" : "");
  }
}
