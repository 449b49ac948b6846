package org.precedent.api.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;

/**
 * Lowers the calling thread's scheduling priority (Linux nice 10), so that training beside the
 * running service takes the processors the service leaves idle: on Linux each Java thread is a
 * task with a nice value of its own, inherited by the threads it starts, while {@link
 * Thread#setPriority} is ignored under the JVM's default policy. Best effort: where there is no
 * {@code /proc/thread-self} or no {@code renice}, training runs at normal priority and says so.
 */
final class LowerPriority {
  static final int NICE = 10;

  private LowerPriority() {}

  /** @return whether the thread now runs at the lower priority */
  static boolean ofThisThread(PrintWriter out) {
    Thread.currentThread().setPriority(Thread.MIN_PRIORITY);
    try {
      // "/proc/thread-self" links to "PID/task/TID": the kernel's id of this very thread.
      Path self = Files.readSymbolicLink(Path.of("/proc/thread-self"));
      String tid = self.getFileName().toString();
      Process p = new ProcessBuilder("renice", "-n", Integer.toString(NICE), "-p", tid)
          .redirectErrorStream(true).redirectOutput(ProcessBuilder.Redirect.DISCARD).start();
      if (p.waitFor(10, TimeUnit.SECONDS) && p.exitValue() == 0) {
        return true;
      }
      p.destroy();
    } catch (IOException | UnsupportedOperationException | SecurityException e) {
      // Not Linux, or no renice: said below.
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
    out.println("(the background training could not lower its priority; it shares the "
        + "processors with the service equally)");
    out.flush();
    return false;
  }
}
