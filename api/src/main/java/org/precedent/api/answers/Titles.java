package org.precedent.api.answers;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Readable titles for answers: the category and the answer's most distinctive words, those that
 * occur often in it and in few other answers (tf-idf; Sparck Jones 1972 for the inverse document
 * frequency), in the order the answer uses them.
 */
final class Titles {
  static final int WORDS = 3;
  static final int MAX_CHARS = 200;
  // Slot markers and redaction placeholders name no topic.
  private static final Pattern NOT_WORDS = Pattern.compile("⟦[^⟧]*⟧|\\[[A-Z_]+\\]");
  private static final Pattern WORD = Pattern.compile("[\\p{L}][\\p{L}\\p{N}'-]*");
  // Words of four letters or more that say nothing of a topic; common practice, no source.
  private static final Set<String> STOP = Set.of("your", "you're", "that", "this", "with", "from",
      "have", "will", "been", "were", "they", "them", "their", "there", "what", "when", "which",
      "would", "could", "should", "about", "into", "also", "please", "thank", "thanks", "just",
      "than", "then", "only", "some", "more", "very", "here", "does", "done", "once", "each",
      "after", "before", "again", "because", "while", "these", "those", "other", "like", "make",
      "need", "sure", "know", "let's", "we're", "we've", "you've", "it's", "don't");

  private final Map<String, Integer> documentFrequency = new HashMap<>();
  private final int documents;

  /** Over all answers' texts: a word's rarity among them makes it distinctive. */
  Titles(List<String> texts) {
    for (String text : texts) {
      for (String w : new HashSet<>(words(text))) {
        documentFrequency.merge(w, 1, Integer::sum);
      }
    }
    this.documents = Math.max(1, texts.size());
  }

  String title(String category, String text) {
    List<String> words = words(text);
    Map<String, Integer> first = new LinkedHashMap<>();
    Map<String, Integer> tf = new HashMap<>();
    for (int i = 0; i < words.size(); i++) {
      first.putIfAbsent(words.get(i), i);
      tf.merge(words.get(i), 1, Integer::sum);
    }
    List<String> best = new ArrayList<>(first.keySet());
    best.sort(Comparator.comparingDouble((String w) -> -tf.get(w) * Math.log(
        (double) documents / documentFrequency.getOrDefault(w, 1))).thenComparing(first::get));
    List<String> chosen = new ArrayList<>(best.subList(0, Math.min(WORDS, best.size())));
    chosen.sort(Comparator.comparing(first::get));
    String words3 = String.join(", ", chosen);
    String title = category == null || category.isBlank() ? words3
        : words3.isEmpty() ? category : category + " — " + words3;
    if (title.isEmpty()) {
      title = "answer";
    }
    return title.length() <= MAX_CHARS ? title : title.substring(0, MAX_CHARS);
  }

  private static List<String> words(String text) {
    List<String> out = new ArrayList<>();
    Matcher m = WORD.matcher(NOT_WORDS.matcher(text).replaceAll(" "));
    while (m.find()) {
      String w = m.group().toLowerCase(Locale.ROOT);
      if (w.length() >= 4 && !STOP.contains(w)) {
        out.add(w);
      }
    }
    return out;
  }
}
