package org.precedent.knowledge.ingest;

import java.io.BufferedInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;

/** Finds the first byte that breaks UTF-8 (RFC 3629, section 4), to say where a file is wrong. */
final class Utf8Scan {
  private Utf8Scan() {}

  /** {line, byte offset} of the first invalid sequence, or null if none was found. */
  static long[] firstInvalid(Path file) {
    try (InputStream in = new BufferedInputStream(Files.newInputStream(file))) {
      long line = 1;
      long offset = 0;
      int pending = 0;
      int b;
      while ((b = in.read()) >= 0) {
        if (pending > 0) {
          if ((b & 0xC0) != 0x80) {
            return new long[] {line, offset};
          }
          pending--;
        } else if (b >= 0xC2 && b <= 0xDF) {
          pending = 1;
        } else if (b >= 0xE0 && b <= 0xEF) {
          pending = 2;
        } else if (b >= 0xF0 && b <= 0xF4) {
          pending = 3;
        } else if (b >= 0x80) {
          return new long[] {line, offset};
        } else if (b == '\n') {
          line++;
        }
        offset++;
      }
      return pending > 0 ? new long[] {line, offset} : null;
    } catch (IOException e) {
      return null;
    }
  }
}
