package org.precedent.api.cli;

/** Small text helpers for terminal output. */
final class Text {
  private Text() {}

  static String abbreviate(String s, int max) {
    String one = s.replaceAll("\\s+", " ").strip();
    return one.length() <= max ? one : one.substring(0, max - 3) + "...";
  }
}
