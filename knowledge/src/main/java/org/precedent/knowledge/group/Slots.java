package org.precedent.knowledge.group;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.precedent.knowledge.align.GlobalAlignment;

/**
 * Finds where the replies of one answer group differ (a day, a date, an amount, a name) by aligning
 * each reply to the canonical one word by word: a canonical word that too few replies share at its
 * position becomes part of a slot, and the group's answer becomes a template such as
 * {@code Your bin collection day is ⟦slot:day⟧}. A template is not sent as it stands: the decision
 * hands off so that someone fills its slots with this customer's details.
 *
 * <p>The marker {@code ⟦slot:NAME⟧} uses mathematical white brackets, which a cleaned reply never
 * holds once {@link #of} refuses replies that do; the name says what the canonical reply held
 * there when its form tells (day, date, time, amount, number, name), else {@code detail}.
 */
public final class Slots {
  /** Opens a slot marker. */
  public static final String OPEN = "⟦slot:";
  /** Closes a slot marker. */
  public static final String CLOSE = "⟧";
  private static final Pattern MARKER = Pattern.compile("⟦slot:([a-z]+)⟧");

  /**
   * Share of the group's replies that must hold a canonical word at its place for the word to be
   * common. Half: a word most replies repeat is part of the answer, one fewer than half share is a
   * detail of each customer's own (common practice, no source; see SlotsTest for the pairs).
   */
  static final double AGREEMENT = 0.5;
  /** More than this share of the canonical words in slots: the replies differ too much. */
  static final double MAX_SLOTTED = 0.3;
  /** More slots than this: keep the canonical reply rather than a template full of gaps. */
  static final int MAX_SLOTS = 4;

  private static final GlobalAlignment<String> ALIGN = GlobalAlignment.byEquality(2, -1, 1);
  private static final Pattern WORD = Pattern.compile("[£$€]?[\\p{L}\\p{N}][\\p{L}\\p{N}'’.,:/£$€-]*[\\p{L}\\p{N}]|\\S");

  private Slots() {}

  /**
   * The template for a group's replies, or empty when there is nothing to mark: a single reply,
   * replies that agree everywhere, or replies that differ in too many places.
   */
  public static Optional<String> of(String canonical, List<String> replies) {
    if (replies.size() < 2 || canonical.contains("⟦") || canonical.contains(CLOSE)) {
      return Optional.empty();
    }
    List<String> base = words(canonical);
    if (base.isEmpty()) {
      return Optional.empty();
    }
    int[] agree = agreement(base, replies);
    // The template keeps the canonical reply's own text between slots, spacing and punctuation
    // included; only the words of each slot are replaced by its marker.
    List<int[]> spans = spans(canonical);
    StringBuilder out = new StringBuilder();
    int slots = 0;
    int slotted = 0;
    int copied = 0;
    int i = 0;
    while (i < base.size()) {
      if (agree[i] >= AGREEMENT * replies.size()) {
        i++;
        continue;
      }
      int start = i;
      while (i < base.size() && agree[i] < AGREEMENT * replies.size()) {
        i++;
      }
      slots++;
      slotted += i - start;
      out.append(canonical, copied, spans.get(start)[0])
          .append(OPEN).append(name(base.subList(start, i))).append(CLOSE);
      copied = spans.get(i - 1)[1];
    }
    out.append(canonical.substring(copied));
    if (slots == 0 || slots > MAX_SLOTS || slotted > MAX_SLOTTED * base.size()) {
      return Optional.empty();
    }
    return Optional.of(out.toString());
  }

  private static int[] agreement(List<String> base, List<String> replies) {
    int[] agree = new int[base.size()];
    for (String reply : replies) {
      for (GlobalAlignment.Column<String> c : ALIGN.align(base, words(reply)).columns()) {
        if (c.paired() && c.first().equals(c.second())) {
          agree[c.firstIndex()]++;
        }
      }
    }
    return agree;
  }

  /**
   * Whether sending the canonical reply to the customer whose own reply was {@code own} would
   * give them another customer's detail: a canonical word at a slot position that {@code own}
   * does not hold there. Measures what a template prevents; false when the group has no template.
   */
  public static boolean wouldSendAnothersDetail(String canonical, List<String> replies,
      String own) {
    if (of(canonical, replies).isEmpty()) {
      return false;
    }
    List<String> base = words(canonical);
    int[] agree = agreement(base, replies);
    boolean[] same = new boolean[base.size()];
    for (GlobalAlignment.Column<String> c : ALIGN.align(base, words(own)).columns()) {
      if (c.paired() && c.first().equals(c.second())) {
        same[c.firstIndex()] = true;
      }
    }
    for (int i = 0; i < base.size(); i++) {
      if (agree[i] < AGREEMENT * replies.size() && !same[i]) {
        return true;
      }
    }
    return false;
  }

  /** The names of the slots a text holds, in order; empty for a text with none. */
  public static List<String> names(String text) {
    List<String> names = new ArrayList<>();
    Matcher m = MARKER.matcher(text == null ? "" : text);
    while (m.find()) {
      names.add(m.group(1));
    }
    return names;
  }

  /** Whether a text holds a slot marker. */
  public static boolean hasSlots(String text) {
    return text != null && MARKER.matcher(text).find();
  }

  static List<String> words(String text) {
    List<String> words = new ArrayList<>();
    Matcher m = WORD.matcher(text);
    while (m.find()) {
      words.add(m.group());
    }
    return words;
  }

  private static List<int[]> spans(String text) {
    List<int[]> spans = new ArrayList<>();
    Matcher m = WORD.matcher(text);
    while (m.find()) {
      spans.add(new int[] {m.start(), m.end()});
    }
    return spans;
  }

  private static final Pattern DAY = Pattern.compile(
      "(?i)(monday|tuesday|wednesday|thursday|friday|saturday|sunday)s?");
  private static final Pattern MONTH = Pattern.compile(
      "(?i)(january|february|march|april|may|june|july|august|september|october|november|december)");
  private static final Pattern TIME = Pattern.compile("(?i)\\d{1,2}([:.]\\d{2})?(am|pm)?|noon|midnight");
  private static final Pattern AMOUNT = Pattern.compile("[£$€]\\d[\\d,.]*|\\d[\\d,.]*(p|€)");
  private static final Pattern DATE = Pattern.compile("\\d{1,4}[/-]\\d{1,2}[/-]\\d{1,4}|\\d{1,2}(st|nd|rd|th)");

  /** Names a slot from what the canonical reply held there; the form only names, never finds. */
  static String name(List<String> span) {
    String joined = String.join(" ", span);
    if (span.stream().anyMatch(w -> DAY.matcher(w).matches())) {
      return "day";
    }
    if (span.stream().anyMatch(w -> MONTH.matcher(w).matches() || DATE.matcher(w).matches())) {
      return "date";
    }
    if (span.stream().anyMatch(w -> AMOUNT.matcher(w).matches())) {
      return "amount";
    }
    if (joined.toLowerCase(Locale.ROOT).matches(".*\\d.*(am|pm)|\\d{1,2}[:.]\\d{2}")) {
      return "time";
    }
    if (span.stream().anyMatch(w -> w.chars().anyMatch(Character::isDigit))) {
      return "number";
    }
    if (span.stream().allMatch(w -> Character.isUpperCase(w.codePointAt(0)))) {
      return "name";
    }
    return "detail";
  }
}
