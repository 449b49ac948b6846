package org.precedent.api.cli;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;

/**
 * Standard output for the libraries, with the numeric library's debugging lines taken out. ND4J
 * 1.0.0-M2.1 prints "Added differentiated op NAME" with {@code System.out.println} (not through a
 * logger, so no logging setting silences it) whenever it builds the gradient of an attention layer.
 * Every other line passes through unchanged.
 */
final class LibraryChatter extends OutputStream {
  private static final byte[] CHATTER =
      "Added differentiated op ".getBytes(StandardCharsets.US_ASCII);

  private final OutputStream out;
  private final ByteArrayOutputStream line = new ByteArrayOutputStream();

  LibraryChatter(OutputStream out) {
    this.out = out;
  }

  @Override
  public synchronized void write(int b) throws IOException {
    line.write(b);
    if (b == '\n') {
      byte[] bytes = line.toByteArray();
      line.reset();
      if (!startsWithChatter(bytes)) {
        out.write(bytes);
      }
    }
  }

  /** Writes out a partial line, unless it may still turn out to be chatter. */
  @Override
  public synchronized void flush() throws IOException {
    byte[] bytes = line.toByteArray();
    int n = Math.min(bytes.length, CHATTER.length);
    if (bytes.length > 0 && !Arrays.equals(bytes, 0, n, CHATTER, 0, n)) {
      out.write(bytes);
      line.reset();
    }
    out.flush();
  }

  private static boolean startsWithChatter(byte[] bytes) {
    return bytes.length >= CHATTER.length
        && Arrays.equals(bytes, 0, CHATTER.length, CHATTER, 0, CHATTER.length);
  }
}
