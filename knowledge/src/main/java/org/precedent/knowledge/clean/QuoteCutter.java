package org.precedent.knowledge.clean;

import java.util.ArrayList;
import java.util.List;
import java.util.regex.Pattern;

/**
 * Removes earlier messages carried along in a mail: lines quoted with '>', and everything from the
 * first line that starts an earlier message, a signature or a mobile footer. A cut point on the
 * first line with content is ignored: then the whole text is that earlier message (a forwarded
 * letter, say) and it is all there is to learn from.
 */
final class QuoteCutter {
  private static final Pattern WROTE_ONE_LINE = Pattern.compile("(?i)on\\s.{1,200}\\swrote:");
  // Mail clients wrap a long "On <date>, <name> <address> wrote:" over two lines.
  private static final Pattern ON_LINE = Pattern.compile("(?i)on\\s.{3,200}");
  private static final Pattern WROTE_LINE = Pattern.compile("(?i).{0,200}\\bwrote:");
  private static final Pattern ORIGINAL = Pattern.compile("(?i)-{2,}\\s*original\\s+message\\s*-{2,}");
  private static final Pattern FROM = Pattern.compile("(?i)from:\\s*\\S.*");
  private static final Pattern FROM_AND_SENT = Pattern.compile("(?i)from:\\s*\\S.{0,200}?\\s(?:sent|date):\\s*\\S.*");
  private static final Pattern SENT_OR_DATE = Pattern.compile("(?i)(?:sent|date):\\s*\\S.*");
  // Mobile mail footers, a handful of words long; longer lines are sentences that start alike.
  private static final Pattern SENT_FROM_MY = Pattern.compile("(?i)sent\\s+from\\s+my\\s+\\S+(?:\\s+\\S+){0,3}");
  // The signature separator is "-- " (RFC 3676 section 4.3); lines are already trimmed here.
  private static final String SIGNATURE_SEPARATOR = "--";
  private static final int HEADER_LOOKAHEAD = 4;

  private QuoteCutter() {}

  /** Text form for normalised text, used before redaction so quoted threads are never scanned. */
  static String cut(String text) {
    List<String> lines = new ArrayList<>();
    for (String line : Whitespace.lines(text)) {
      lines.add(line.strip());
    }
    cut(lines);
    return String.join("\n", lines);
  }

  /** Cuts the (already trimmed) lines in place. */
  static void cut(List<String> lines) {
    lines.removeIf(line -> line.startsWith(">"));
    int first = Wording.firstContent(lines);
    if (first < 0) {
      return;
    }
    for (int i = first + 1; i < lines.size(); i++) {
      if (startsEarlierMessage(lines, i)) {
        lines.subList(i, lines.size()).clear();
        return;
      }
    }
  }

  private static boolean startsEarlierMessage(List<String> lines, int i) {
    String line = lines.get(i);
    if (line.isEmpty() || !mayStartEarlierMessage(line.charAt(0))) {
      return false;
    }
    if (line.equals(SIGNATURE_SEPARATOR)
        || ORIGINAL.matcher(line).matches()
        || SENT_FROM_MY.matcher(line).matches()
        || WROTE_ONE_LINE.matcher(line).matches()
        || FROM_AND_SENT.matcher(line).matches()) {
      return true;
    }
    if (ON_LINE.matcher(line).matches()) {
      int next = nextContent(lines, i + 1);
      return next >= 0 && WROTE_LINE.matcher(lines.get(next)).matches();
    }
    if (FROM.matcher(line).matches()) {
      int end = Math.min(lines.size(), i + 1 + HEADER_LOOKAHEAD);
      for (int k = i + 1; k < end; k++) {
        if (SENT_OR_DATE.matcher(lines.get(k)).matches()) {
          return true;
        }
      }
    }
    return false;
  }

  // Every pattern above starts with '-', "sent", "on" or "from": one character rules most lines out.
  private static boolean mayStartEarlierMessage(char c) {
    char l = Character.toLowerCase(c);
    return l == '-' || l == 's' || l == 'o' || l == 'f';
  }

  private static int nextContent(List<String> lines, int from) {
    for (int k = from; k < lines.size(); k++) {
      if (!lines.get(k).isEmpty()) {
        return k;
      }
    }
    return -1;
  }
}
