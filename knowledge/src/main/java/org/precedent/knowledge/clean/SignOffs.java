package org.precedent.knowledge.clean;

import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Removes what closes a message after its substance: a sign-off with the signature under it
 * ("Kind regards,\nSam\nTVWW Customer Care"), a sign-off at the end of the last sentence
 * ("... today? Thanks, Priya"), and in agents' replies the stock closing lines ("If you have any
 * other questions ..."). A sign-off is only taken when everything below it looks like a
 * signature, so a "Thanks" followed by more of the question is left in place.
 */
final class SignOffs {
  private static final Pattern SIGN_OFF = Pattern.compile("(?i)(?:(?:many|kind|kindest|best|warm|warmest"
      + "|with|with\\s+many|with\\s+kind|all\\s+the|sincere|heartfelt)\\s+)?"
      + "(?:thanks|thank\\s+you|thankyou|thx|ta|cheers|regards|wishes|best|sincerely"
      + "|yours\\s+(?:sincerely|faithfully|truly)|take\\s+care|speak\\s+soon|respectfully)"
      + "(?![\\p{L}])(?<tail>.*)");
  // What may follow "Thanks" in a closing line without it becoming a sentence of its own.
  private static final Pattern POLITE_TAIL = Pattern.compile("(?i)(?:again|in\\s+advance|so\\s+much|very\\s+much"
      + "|a\\s+lot|all|everyone|for\\s+(?:your|the|all|everything|looking|helping|getting|sorting|any))(?![\\p{L}]).*");
  private static final Pattern INLINE_SIGN_OFF = Pattern.compile("(?<=[.!?])\\s+"
      + "(?i:(?:many\\s+|kind\\s+|best\\s+|warm\\s+)?(?:thanks|thank\\s+you|cheers|regards|wishes)"
      + "(?:\\s+(?:in\\s+advance|again|so\\s+much|very\\s+much))?)"
      + "(?:\\s*[,!.]?\\s*\\p{Lu}[\\p{L}'’-]*){0,2}\\s*[.!]?$");
  private static final Pattern RULE_LINE = Pattern.compile("[-_=*~]{2,}");
  private static final Pattern AGENT_CLOSER = Pattern.compile("(?i)(?:"
      + "(?:i\\s+|we\\s+)?hope\\s+(?:this|that)\\s+(?:helps|has\\s+helped|answers\\s+your\\s+question)(?![\\p{L}]).{0,40}"
      + "|(?:please\\s+)?(?:do\\s+not|don't|don’t)\\s+hesitate\\s+to(?![\\p{L}]).{0,120}"
      + "|if\\s+you\\s+(?:have|need)\\s+any\\s+(?:further|other|more)(?![\\p{L}]).{0,120}"
      + "|(?:please\\s+)?let\\s+(?:me|us)\\s+know\\s+if\\s+(?:there\\s+is\\s+|you\\s+(?:have|need)\\s+)?"
      + "(?:anything\\s+else|any\\s+(?:further|other|more)\\s+(?:questions|help|queries))(?![\\p{L}]).{0,60}"
      + "|have\\s+a\\s+(?:great|good|lovely|nice|wonderful)\\s+(?:day|week|weekend|evening|afternoon)(?![\\p{L}]).{0,20})");

  // Customers sign with a name or two; agents' replies carry a longer company footer.
  private static final int QUESTION_SIGNATURE_LINES = 4;
  private static final int REPLY_SIGNATURE_LINES = 7;
  private static final int MAX_SIGNATURE_WORDS = 6;
  private static final int MAX_NAME_WORDS = 3;
  private static final int MAX_POLITE_WORDS = 6;
  // Longest inline sign-off looked for: "Many thanks in advance, " and two names; no real one
  // comes near (common practice, no source).
  private static final int MAX_INLINE_CHARS = 200;

  private SignOffs() {}

  /** Strips closings from the end until none is left, at most {@code max}; returns how many. */
  static int strip(List<String> lines, boolean agentReply, int max) {
    int taken = 0;
    while (taken < max && stripOnce(lines, agentReply)) {
      taken++;
    }
    return taken;
  }

  private static boolean stripOnce(List<String> lines, boolean agentReply) {
    int first = Wording.firstContent(lines);
    int last = Wording.lastContent(lines);
    if (first < 0) {
      return false;
    }
    if (last > first && RULE_LINE.matcher(lines.get(last)).matches()) {
      lines.set(last, "");
      return true;
    }
    int cut = signOffBlock(lines, first, last, agentReply ? REPLY_SIGNATURE_LINES : QUESTION_SIGNATURE_LINES);
    if (cut >= 0) {
      lines.subList(cut, lines.size()).clear();
      return true;
    }
    if (agentReply && last > first && AGENT_CLOSER.matcher(lines.get(last)).matches()) {
      lines.set(last, "");
      return true;
    }
    return inlineSignOff(lines, last);
  }

  /**
   * The highest line below the first that is a sign-off with only signature-like lines (or further
   * sign-offs) under it, no more than {@code maxBelow} of them. Failing that, the first line itself
   * when the whole text is such a closing (then nothing is left and the caller keeps the original);
   * -1 when there is none.
   */
  private static int signOffBlock(List<String> lines, int first, int last, int maxBelow) {
    int best = -1;
    int below = 0;
    for (int i = last; i >= first && below <= maxBelow; i--) {
      String line = lines.get(i);
      if (line.isEmpty()) {
        continue;
      }
      boolean signOff = isSignOff(line);
      if (signOff && (i > first || best < 0)) {
        best = i;
      } else if (!signOff && !isSignatureLine(line)) {
        break;
      }
      below++;
    }
    return best;
  }

  static boolean isSignOff(String line) {
    if (line.indexOf('?') >= 0) {
      return false;
    }
    Matcher m = SIGN_OFF.matcher(line);
    if (!m.matches()) {
      return false;
    }
    String tail = trimPunctuation(m.group("tail"));
    if (tail.isEmpty()) {
      return true;
    }
    List<String> words = Wording.words(tail);
    if (words.size() <= MAX_NAME_WORDS && !Wording.hasSentenceWord(tail) && allNameLike(words)) {
      return true; // "Thanks, Priya", "Regards, Tom Fairley"
    }
    return words.size() <= MAX_POLITE_WORDS && POLITE_TAIL.matcher(tail).matches();
  }

  /** A line of a signature block: a few words naming a person, team or contact, no sentence. */
  private static boolean isSignatureLine(String line) {
    return line.indexOf('?') < 0
        && Wording.countWords(line) <= MAX_SIGNATURE_WORDS
        && !Wording.hasSentenceWord(line);
  }

  private static boolean inlineSignOff(List<String> lines, int last) {
    String line = lines.get(last);
    // The sign-off ends the line, so only the line's end is searched: each search then costs the
    // same however long the line, and stacked sign-offs cost no more than a pass each.
    Matcher m = INLINE_SIGN_OFF.matcher(line).useTransparentBounds(true)
        .region(Math.max(0, line.length() - MAX_INLINE_CHARS), line.length());
    if (!m.find()) {
      return false;
    }
    lines.set(last, line.substring(0, m.start()));
    return true;
  }

  private static boolean allNameLike(List<String> words) {
    for (String w : words) {
      if (!Wording.nameLike(w)) {
        return false;
      }
    }
    return true;
  }

  private static String trimPunctuation(String s) {
    int a = 0;
    int b = s.length();
    while (a < b && !Character.isLetterOrDigit(s.charAt(a)) && s.charAt(a) != '[') {
      a++;
    }
    while (b > a && !Character.isLetterOrDigit(s.charAt(b - 1)) && s.charAt(b - 1) != ']') {
      b--;
    }
    return s.substring(a, b);
  }
}
