package org.precedent.knowledge.clean;

import java.util.List;
import java.util.function.Predicate;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A rule whose pattern decides: every match becomes the placeholder, unless it is one the rule
 * keeps (the organisation's own number, say). The pre-check is a cheap necessary condition (see
 * {@link Scan}) that spares most texts the regular expression.
 */
final class PatternRule implements Redactor.Rule {
  private final Pattern pattern;
  private final String placeholder;
  private final String replacement;
  private final Predicate<String> mayMatch;
  private final Predicate<String> keep;

  PatternRule(Pattern pattern, String placeholder, Predicate<String> mayMatch) {
    this(pattern, placeholder, mayMatch, match -> false);
  }

  private PatternRule(Pattern pattern, String placeholder, Predicate<String> mayMatch,
      Predicate<String> keep) {
    this.pattern = pattern;
    this.placeholder = placeholder;
    this.replacement = Matcher.quoteReplacement(placeholder);
    this.mayMatch = mayMatch;
    this.keep = keep;
  }

  /** The same rule, leaving the matches {@code keep} accepts as they are. */
  PatternRule keeping(Predicate<String> keep) {
    return new PatternRule(pattern, placeholder, mayMatch, keep);
  }

  @Override
  public String apply(String text) {
    if (!mayMatch.test(text)) {
      return text;
    }
    return pattern.matcher(text).replaceAll(
        m -> keep.test(m.group()) ? Matcher.quoteReplacement(m.group()) : replacement);
  }

  /** Every match in {@code text}, in order. */
  List<String> matches(String text) {
    if (!mayMatch.test(text)) {
      return List.of();
    }
    return pattern.matcher(text).results().map(java.util.regex.MatchResult::group).toList();
  }
}
