package org.precedent.demo;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** The whole catalogue of reusable demo answers, in a fixed order so that generation is reproducible. */
final class DemoAnswers {

  private static final List<DemoAnswer> ALL = build();

  private DemoAnswers() {
  }

  /** Every reusable answer, routine and safety alike. */
  static List<DemoAnswer> all() {
    return ALL;
  }

  static List<DemoAnswer> routine() {
    return ALL.stream().filter(a -> !a.category().equals("safety")).toList();
  }

  static List<DemoAnswer> safety() {
    return ALL.stream().filter(a -> a.category().equals("safety")).toList();
  }

  /** Answer keys grouped by category, for the data set's README. */
  static Map<String, List<String>> keysByCategory() {
    Map<String, List<String>> out = new LinkedHashMap<>();
    for (DemoAnswer a : ALL) {
      out.computeIfAbsent(a.category(), c -> new ArrayList<>()).add(a.key());
    }
    return out;
  }

  private static List<DemoAnswer> build() {
    List<DemoAnswer> all = new ArrayList<>();
    all.addAll(DemoAnswersMoney.all());
    all.addAll(DemoAnswersAccount.all());
    all.addAll(DemoAnswersBins.all());
    all.addAll(DemoAnswersWaste.all());
    all.addAll(DemoAnswersWater.all());
    all.addAll(DemoAnswersSafety.all());
    if (all.stream().map(DemoAnswer::key).distinct().count() != all.size()) {
      throw new IllegalStateException("duplicate answer key in the demo catalogue");
    }
    return Collections.unmodifiableList(all);
  }
}
