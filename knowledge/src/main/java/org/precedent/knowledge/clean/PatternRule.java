package org.precedent.knowledge.clean;

import java.util.function.Predicate;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A rule whose pattern alone decides: every match becomes the placeholder. The pre-check is a
 * cheap necessary condition (see {@link Scan}) that spares most texts the regular expression.
 */
final class PatternRule implements Redactor.Rule {
  private final Pattern pattern;
  private final String replacement;
  private final Predicate<String> mayMatch;

  PatternRule(Pattern pattern, String placeholder, Predicate<String> mayMatch) {
    this.pattern = pattern;
    this.replacement = Matcher.quoteReplacement(placeholder);
    this.mayMatch = mayMatch;
  }

  @Override
  public String apply(String text) {
    return mayMatch.test(text) ? pattern.matcher(text).replaceAll(replacement) : text;
  }
}
