package org.precedent.api.cli;

import java.nio.file.NoSuchFileException;

/** Error messages for people: one line, saying what and where, without a stack trace. */
final class Messages {
  private Messages() {}

  static String oneLine(Throwable e) {
    if (e instanceof NoSuchFileException n) {
      return n.getFile() + ": no such file" + (n.getReason() == null ? "" : " (" + n.getReason() + ")");
    }
    String message = e.getMessage();
    if (message == null || message.isBlank()) {
      message = e.getClass().getSimpleName();
    }
    int cut = message.indexOf('\n');
    return cut < 0 ? message : message.substring(0, cut);
  }
}
