package org.precedent.demo;

import java.util.List;

/**
 * One reusable answer of the demo catalogue, with the ways customers ask for it.
 *
 * <p>Question phrasings and the answer may hold slots such as {@code {date}} or {@code {street}}, filled per
 * ticket by {@link DemoSlots}, so that the same phrasing still reads differently from ticket to ticket.
 *
 * @param key       the answer key, {@code category.topic}; the part before the dot is the ticket category
 * @param weight    how often this answer is needed, relative to the others
 * @param season    when in the year it is needed more often
 * @param answer    the canonical answer text agents reuse
 * @param subjects  subject lines customers give such tickets
 * @param questions distinct phrasings of the question
 */
record DemoAnswer(String key, int weight, Season season, String answer, List<String> subjects, List<String> questions) {

  DemoAnswer {
    if (!key.contains(".")) {
      throw new IllegalArgumentException("answer key must be category.topic: " + key);
    }
    subjects = List.copyOf(subjects);
    questions = List.copyOf(questions);
  }

  String category() {
    return key.substring(0, key.indexOf('.'));
  }

  /** Builds an answer; a terse factory keeps the catalogue classes readable as text. */
  static DemoAnswer of(String key, int weight, Season season, String answer, List<String> subjects,
      String... questions) {
    return new DemoAnswer(key, weight, season, answer, subjects, List.of(questions));
  }

  /** Seasonal demand: water and waste questions follow the weather and the calendar. */
  enum Season {
    ANY, WINTER, SPRING, SUMMER, FESTIVE, APRIL;

    /** How much more often than usual the answer is needed in a month (1 = January). */
    double factor(int month) {
      return switch (this) {
        case ANY -> 1.0;
        case WINTER -> month == 12 || month <= 2 ? 2.5 : month == 3 || month == 11 ? 1.2 : 0.5;
        case SPRING -> month >= 3 && month <= 5 ? 2.5 : month >= 6 && month <= 9 ? 1.0 : 0.4;
        case SUMMER -> month >= 6 && month <= 8 ? 2.5 : 0.6;
        case FESTIVE -> month == 12 ? 4.0 : month == 1 ? 2.0 : month == 4 || month == 5 || month == 8 ? 0.8 : 0.3;
        case APRIL -> month == 3 || month == 4 ? 3.5 : month == 5 ? 1.2 : 0.5;
      };
    }
  }
}
