package org.precedent.knowledge.clean;

import java.util.List;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Removes what opens a message before its substance: a greeting line ("Hi Dana,", "Dear
 * Sir/Madam"), a greeting in front of the first sentence ("Hello, my meter ..."), a pleasantry
 * ("Hope you're well") and, in agents' replies, the thank-you-for-contacting-us line.
 */
final class Salutations {
  private static final String GREETING = "(?:hi|hiya|hello|hey|heya|howdy|dear|greetings"
      + "|good\\s+(?:morning|afternoon|evening|day)|morning|afternoon|evening)(?![\\p{L}])";
  private static final String NAME_WORDS = "(?<names>(?:\\s+[\\p{L}'’./&-]+){0,3})";

  // A whole line that is only a greeting and up to three name words.
  private static final Pattern GREETING_LINE =
      Pattern.compile("(?i)" + GREETING + NAME_WORDS + "\\s*[,.!:]?");
  // A greeting, up to three name words and a separating comma, before the first sentence.
  private static final Pattern GREETING_PREFIX =
      Pattern.compile("(?i)" + GREETING + NAME_WORDS + "\\s*[,!:]\\s+(?=\\S)");

  // Who a greeting may address without a capital letter.
  private static final Set<String> ADDRESSEES = Set.of("there", "team", "all", "everyone", "folks",
      "guys", "sir", "madam", "again", "customer", "support", "both", "y'all");

  private static final String PLEASANTRY_WORDS = "(?:i\\s+)?(?:hope|trust)\\s+"
      + "(?:you(?:'re|’re|\\s+are)\\s+(?:well|keeping\\s+well|doing\\s+well|having\\s+a\\s+(?:good|great|nice|lovely)\\s+(?:day|week))"
      + "|this\\s+(?:email\\s+|message\\s+|e-mail\\s+)?finds\\s+you\\s+well|all\\s+is\\s+well)(?:\\s+today)?";
  private static final Pattern PLEASANTRY = Pattern.compile("(?i)" + PLEASANTRY_WORDS + "\\s*[.!,]?");
  private static final Pattern PLEASANTRY_PREFIX =
      Pattern.compile("(?i)" + PLEASANTRY_WORDS + "\\s*[.!,]\\s+(?=\\S)");

  private static final Pattern AGENT_OPENER = Pattern.compile("(?i)(?:thank\\s+you|thanks|many\\s+thanks)"
      + "(?:\\s+(?:so|very)\\s+much)?\\s+for\\s+(?:contacting|getting\\s+in\\s+touch|reaching\\s+out"
      + "|your\\s+(?:e-?mail|message|enquiry|inquiry|query|patience|call))(?![\\p{L}])"
      + "(?:\\s+[\\p{L}'’&-]+){0,4}\\s*[.!]?");

  private Salutations() {}

  /**
   * Strips openings from the first content line until none is left, at most {@code max} of them;
   * returns how many it took.
   */
  static int strip(List<String> lines, boolean agentReply, int max) {
    int taken = 0;
    while (taken < max) {
      int i = Wording.firstContent(lines);
      if (i < 0) {
        return taken;
      }
      String line = lines.get(i);
      if (isGreetingLine(line)
          || PLEASANTRY.matcher(line).matches()
          || (agentReply && AGENT_OPENER.matcher(line).matches())) {
        lines.set(i, "");
        taken++;
        continue;
      }
      Matcher prefix = GREETING_PREFIX.matcher(line);
      if (prefix.lookingAt() && addressesSomeone(prefix.group("names"))) {
        lines.set(i, line.substring(prefix.end()));
        taken++;
        continue;
      }
      Matcher pleasantry = PLEASANTRY_PREFIX.matcher(line);
      if (pleasantry.lookingAt()) {
        lines.set(i, line.substring(pleasantry.end()));
        taken++;
        continue;
      }
      return taken;
    }
    return taken;
  }

  private static boolean isGreetingLine(String line) {
    Matcher m = GREETING_LINE.matcher(line);
    return m.matches() && addressesSomeone(m.group("names"));
  }

  /**
   * Whether the words after a greeting name its addressee ("Dana", "Sir/Madam", "team") rather than
   * start a sentence ("my meter", "I need"): "Hi meter broken" must stay.
   */
  private static boolean addressesSomeone(String names) {
    if (Wording.hasSentenceWord(names)) {
      return false;
    }
    for (String w : Wording.words(names)) {
      if (!Wording.nameLike(w) && !ADDRESSEES.contains(Wording.bare(w))) {
        return false;
      }
    }
    return true;
  }
}
