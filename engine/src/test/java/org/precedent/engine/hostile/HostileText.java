package org.precedent.engine.hostile;

import java.util.concurrent.atomic.AtomicReference;
import java.util.function.Supplier;

/** Tools for tests of text built to hurt a scanner or a regular expression. */
public final class HostileText {
  private HostileText() {}

  /**
   * Runs {@code work} on a thread with a 256 KB stack, a quarter of the JVM's default, and fails
   * naming {@code what} if it throws (a {@link StackOverflowError} above all).
   */
  public static <T> T onSmallStack(Supplier<T> work, String what) throws InterruptedException {
    AtomicReference<T> result = new AtomicReference<>();
    AtomicReference<Throwable> failure = new AtomicReference<>();
    Thread t = new Thread(null, () -> {
      try {
        result.set(work.get());
      } catch (Throwable e) {
        failure.set(e);
      }
    }, "small-stack", 256 * 1024);
    t.start();
    t.join();
    if (failure.get() != null) {
      throw new AssertionError(what + ": failed on a 256 KB stack: " + failure.get(), failure.get());
    }
    return result.get();
  }

  /** Text that counts how often its characters are read: a measure of work that no load skews. */
  public static final class CountingText implements CharSequence {
    private final String text;
    private long reads;

    public CountingText(String text) {
      this.text = text;
    }

    /** Characters read so far. */
    public long reads() {
      return reads;
    }

    @Override
    public int length() {
      return text.length();
    }

    @Override
    public char charAt(int index) {
      reads++;
      return text.charAt(index);
    }

    @Override
    public CharSequence subSequence(int start, int end) {
      reads += end - start;
      return text.subSequence(start, end);
    }

    @Override
    public String toString() {
      reads += text.length();
      return text;
    }
  }
}
