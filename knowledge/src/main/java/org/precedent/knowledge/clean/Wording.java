package org.precedent.knowledge.clean;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;

/**
 * Small word-level tests shared by the greeting and sign-off strippers. They tell a name or a
 * team ("Tom Fairley", "TVWW Customer Care") from a sentence ("the meter is still broken"), which
 * is what keeps the strippers from eating content.
 */
final class Wording {
  // Pronouns, auxiliaries and the like: common in sentences, rare in names and signatures.
  private static final Set<String> SENTENCE_WORDS = Set.of(
      "i", "i'm", "im", "my", "me", "we", "our", "us", "you", "your", "it", "it's", "its", "is",
      "are", "was", "were", "be", "been", "have", "has", "had", "do", "does", "did", "not", "no",
      "can", "could", "would", "should", "will", "please", "this", "that", "there's", "what",
      "why", "how", "when", "still", "but", "if", "need", "want");

  private Wording() {}

  static List<String> words(String s) {
    List<String> words = new ArrayList<>();
    int start = -1;
    for (int i = 0; i <= s.length(); i++) {
      boolean space = i == s.length() || Character.isWhitespace(s.charAt(i));
      if (space && start >= 0) {
        words.add(s.substring(start, i));
        start = -1;
      } else if (!space && start < 0) {
        start = i;
      }
    }
    return words;
  }

  /** Words with a letter or digit in them; separators such as "|" or "&" do not count. */
  static int countWords(String s) {
    int count = 0;
    for (String w : words(s)) {
      for (int i = 0; i < w.length(); i++) {
        if (Character.isLetterOrDigit(w.charAt(i))) {
          count++;
          break;
        }
      }
    }
    return count;
  }

  static boolean hasSentenceWord(String s) {
    for (String w : words(s)) {
      if (SENTENCE_WORDS.contains(bare(w))) {
        return true;
      }
    }
    return false;
  }

  /** A word that can be part of a name or team: capitalised, a placeholder, or "Sir/Madam". */
  static boolean nameLike(String word) {
    String w = word.replace("’", "'");
    if (w.isEmpty()) {
      return false;
    }
    char c = w.charAt(0);
    return Character.isUpperCase(c) || c == '[' || w.indexOf('/') > 0;
  }

  /** The word lower-cased, without surrounding punctuation, curly apostrophes made straight. */
  static String bare(String word) {
    String w = word.replace("’", "'").toLowerCase(Locale.ROOT);
    int a = 0;
    int b = w.length();
    while (a < b && !Character.isLetterOrDigit(w.charAt(a))) {
      a++;
    }
    while (b > a && !Character.isLetterOrDigit(w.charAt(b - 1))) {
      b--;
    }
    return w.substring(a, b);
  }

  static int firstContent(List<String> lines) {
    for (int i = 0; i < lines.size(); i++) {
      if (!lines.get(i).isEmpty()) {
        return i;
      }
    }
    return -1;
  }

  static int lastContent(List<String> lines) {
    for (int i = lines.size() - 1; i >= 0; i--) {
      if (!lines.get(i).isEmpty()) {
        return i;
      }
    }
    return -1;
  }
}
