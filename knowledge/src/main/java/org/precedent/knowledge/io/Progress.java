package org.precedent.knowledge.io;

import java.io.PrintStream;
import java.time.Duration;
import java.util.Locale;

/**
 * A progress line for long work: items done, rate, share done and time left, at most about once a
 * second so that it costs nothing measurable.
 *
 * <p>Either the total is known ({@link #total}) or the caller gives the share done directly
 * ({@link #update(long, double)}), as a reader of a file of unknown record count does from bytes.
 */
public final class Progress {
  private static final long INTERVAL_NANOS = 1_000_000_000L;

  private final String what;
  private final String unit;
  private final PrintStream out;
  private long total = -1;
  /** Set by the first update, so that time spent before the work starts does not count. */
  private long startNanos = -1;
  private long lastPrint;
  private boolean printed;

  public Progress(String what, String unit, PrintStream out) {
    this.what = what;
    this.unit = unit;
    this.out = out;
  }

  /** A progress that prints nothing, for tests and quiet runs. */
  public static Progress silent() {
    return new Progress("", "", null);
  }

  public Progress total(long total) {
    this.total = total;
    return this;
  }

  /** Reports {@code done} items out of the known total. */
  public void update(long done) {
    update(done, total > 0 ? done / (double) total : Double.NaN);
  }

  /** Reports {@code done} items, {@code share} (0..1, or NaN if unknown) of the work. */
  public void update(long done, double share) {
    long now = System.nanoTime();
    if (startNanos < 0) {
      startNanos = now;
      lastPrint = now;
    }
    if (out == null || now - lastPrint < INTERVAL_NANOS) {
      return;
    }
    lastPrint = now;
    printed = true;
    out.println(line(done, share, now));
  }

  /** Prints the final line, if any line was printed before (short work stays quiet). */
  public void finish(long done) {
    if (out != null && printed) {
      out.println(line(done, 1.0, System.nanoTime()));
    }
  }

  String line(long done, double share, long now) {
    double seconds = Math.max(1e-9, (now - startNanos) / 1e9);
    double rate = done / seconds;
    StringBuilder s = new StringBuilder(what).append(": ")
        .append(String.format(Locale.ROOT, "%,d %s, %,.0f %s/s", done, unit, rate, unit));
    if (!Double.isNaN(share) && share > 0) {
      double left = seconds * (1 - share) / share;
      s.append(String.format(Locale.ROOT, ", %.0f%%, %s left", share * 100, format(left)));
    }
    return s.toString();
  }

  static String format(double seconds) {
    Duration d = Duration.ofSeconds(Math.round(seconds));
    if (d.toHours() > 0) {
      return String.format(Locale.ROOT, "%dh%02dm", d.toHours(), d.toMinutesPart());
    }
    if (d.toMinutes() > 0) {
      return String.format(Locale.ROOT, "%dm%02ds", d.toMinutes(), d.toSecondsPart());
    }
    return d.toSeconds() + "s";
  }
}
