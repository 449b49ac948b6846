package org.precedent.api.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.OptionalLong;

/**
 * A process's resident memory and its peak, as Linux reports them in {@code /proc/PID/status}
 * ({@code VmRSS}, {@code VmHWM}, in kB; proc(5)). What the process's collectors count (heap,
 * direct buffers) leaves out the numeric library's native memory; this does not.
 */
final class Resident {
  private Resident() {}

  /** Prints "service resident N MB (peak M MB) WHEN", or nothing when it cannot be read. */
  static void print(PrintWriter out, long pid, String when) {
    if (pid < 0) {
      return;
    }
    Path status = Path.of("/proc", Long.toString(pid), "status");
    try {
      String text = Files.readString(status, StandardCharsets.US_ASCII);
      OptionalLong now = kilobytes(text, "VmRSS:");
      OptionalLong peak = kilobytes(text, "VmHWM:");
      if (now.isPresent() && peak.isPresent()) {
        out.printf(Locale.ROOT, "service resident %,d MB (peak %,d MB) %s%n",
            now.getAsLong() / 1024, peak.getAsLong() / 1024, when);
      }
    } catch (IOException e) {
      out.println("service resident memory unknown " + when + ": cannot read " + status + " ("
          + Messages.oneLine(e) + ")");
    }
  }

  /** The value of a "Name:   1234 kB" line, in kB. */
  static OptionalLong kilobytes(String status, String name) {
    for (String line : status.split("\n")) {
      if (line.startsWith(name)) {
        String[] parts = line.substring(name.length()).trim().split("\\s+");
        if (parts.length == 2 && parts[1].equals("kB")) {
          try {
            return OptionalLong.of(Long.parseLong(parts[0]));
          } catch (NumberFormatException e) {
            return OptionalLong.empty();
          }
        }
      }
    }
    return OptionalLong.empty();
  }
}
