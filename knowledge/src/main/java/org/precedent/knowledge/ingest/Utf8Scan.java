package org.precedent.knowledge.ingest;

import java.io.IOException;
import java.io.InputStream;
import java.io.Reader;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.util.ArrayDeque;
import java.util.Locale;

/**
 * Decodes UTF-8 text (RFC 3629) and notes where it is broken: each invalid byte sequence becomes
 * U+FFFD in the text, and its line and byte offset are kept until the reader of the text asks for
 * them. So one bad byte costs the row it is in, not the whole file, and the row's problem can say
 * exactly where the byte is.
 *
 * <p>Lines are counted as commons-csv and {@link java.io.BufferedReader#readLine()} count them: a
 * line ends at LF, CR, or CR LF.
 */
final class Utf8Scan extends Reader {
  static final char REPLACEMENT = '\uFFFD';

  /**
   * One invalid byte sequence.
   *
   * @param line      the line it is on (1-based)
   * @param offset    its offset in the file, in bytes counted from 0
   * @param firstByte its first byte
   */
  record Invalid(long line, long offset, int firstByte) {
    @Override
    public String toString() {
      return String.format(Locale.ROOT, "byte 0x%02X at byte offset %,d", firstByte, offset);
    }
  }

  private final InputStream in;
  private final CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
      .onMalformedInput(CodingErrorAction.REPORT)
      .onUnmappableCharacter(CodingErrorAction.REPORT);
  private final ByteBuffer bytes = ByteBuffer.allocate(16384).flip();
  private final CharBuffer chars = CharBuffer.allocate(16384).flip();
  private final ArrayDeque<Invalid> found = new ArrayDeque<>();
  /** File offset of {@code bytes} index 0. */
  private long base;
  private long line = 1;
  private boolean afterCr;
  private boolean endOfInput;
  private boolean finished;

  Utf8Scan(InputStream in) {
    this.in = in;
  }

  /**
   * The first invalid sequence on a line before {@code line}, or null; forgets every such
   * sequence. The text before that line must have been read already.
   */
  Invalid takeBefore(long line) {
    Invalid first = null;
    while (!found.isEmpty() && found.peekFirst().line() < line) {
      Invalid next = found.pollFirst();
      if (first == null) {
        first = next;
      }
    }
    return first;
  }

  @Override
  public int read(char[] out, int offset, int length) throws IOException {
    if (length == 0) {
      return 0;
    }
    if (!chars.hasRemaining() && !fill()) {
      return -1;
    }
    int n = Math.min(length, chars.remaining());
    chars.get(out, offset, n);
    return n;
  }

  /** Decodes the next piece of text into {@code chars}; false at the end of the file. */
  private boolean fill() throws IOException {
    chars.clear();
    while (chars.position() == 0 && !finished) {
      int from = chars.position();
      CoderResult result = decoder.decode(bytes, chars, endOfInput);
      countLines(from);
      if (result.isError()) {
        if (!chars.hasRemaining()) {
          break;
        }
        int at = bytes.position();
        found.addLast(new Invalid(line, base + at, bytes.get(at) & 0xFF));
        bytes.position(at + result.length());
        chars.put(REPLACEMENT);
        afterCr = false;
      } else if (result.isUnderflow()) {
        if (endOfInput) {
          from = chars.position();
          decoder.flush(chars);
          countLines(from);
          finished = true;
        } else {
          readMore();
        }
      }
    }
    chars.flip();
    return chars.hasRemaining();
  }

  private void readMore() throws IOException {
    base += bytes.position();
    bytes.compact();
    int n = in.read(bytes.array(), bytes.position(), bytes.remaining());
    if (n < 0) {
      endOfInput = true;
    } else {
      bytes.position(bytes.position() + n);
    }
    bytes.flip();
  }

  private void countLines(int from) {
    for (int i = from; i < chars.position(); i++) {
      char c = chars.get(i);
      if (c == '\r') {
        line++;
        afterCr = true;
      } else {
        if (c == '\n' && !afterCr) {
          line++;
        }
        afterCr = false;
      }
    }
  }

  @Override
  public void close() throws IOException {
    in.close();
  }
}
