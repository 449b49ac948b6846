package org.precedent.engine.safety;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.precedent.knowledge.ticket.Category;

/**
 * Decides whether a ticket is one Precedent must never answer on its own, and what to tell the customer instead.
 *
 * <p>Three things make a ticket human-only, checked in this order: a term rule matching the question, the ticket's
 * category, and the proposed answer group. Term rules come first because their caution speaks to the risk itself
 * (leave the building, don't drink the water), while the other two can only give the general caution.
 *
 * <p>Every term rule is tried, and the finding lists all that match in precedence order: rules naming the situation
 * ({@link SafetyRule.Specificity#SITUATION}) before rules naming only a sign of it
 * ({@link SafetyRule.Specificity#SIGN}), and among equals, the policy's rule order, in which the built-in rules run
 * from the most urgent risk to the least. Precedence by specificity first: a sign such as a foul smell is produced
 * by several situations, and when the words also name one of them (sewage coming up through the drain), that is
 * what is happening, so its advice is what the customer needs first; the sign's own caution still follows.
 *
 * <p>Immutable and safe to share between threads.
 */
public final class SafetyPolicy {

  private static final Pattern SPACE = Pattern.compile("\\s+");
  private static final Pattern CURLY_APOSTROPHE = Pattern.compile("[\u2018\u2019\u02bc`]");

  private final List<SafetyRule> rules;
  private final Set<String> humanOnlyGroups;
  private final Set<String> humanOnlyCategories;
  private final String emergencyLine;

  SafetyPolicy(List<SafetyRule> rules, Set<String> humanOnlyGroups, Set<String> humanOnlyCategories,
      String emergencyLine) {
    this.rules = List.copyOf(rules);
    this.humanOnlyGroups = frozen(humanOnlyGroups, false);
    this.humanOnlyCategories = frozen(humanOnlyCategories, true);
    this.emergencyLine = Objects.requireNonNull(emergencyLine, "emergencyLine");
  }

  /**
   * The built-in rules: the general part and every trade pack, with cautions naming
   * {@value Cautions#DEFAULT_EMERGENCY_LINE}. Every pack, because without a policy file nobody has said what trade
   * the help desk serves, and what a pack's rules name (sewage in the house, a power line down) puts someone at risk
   * whichever desk hears of it; a policy file can narrow the packs. No category or group is human-only: those names
   * belong to each help desk, so only its policy file can give them.
   */
  public static SafetyPolicy defaults() {
    return new SafetyPolicy(compileDefaults(DefaultRules.TRADE_PACKS, Cautions.DEFAULT_EMERGENCY_LINE), Set.of(),
        Set.of(), Cautions.DEFAULT_EMERGENCY_LINE);
  }


  /**
   * Reads a policy file (format in the package description).
   *
   * @throws IOException if the file cannot be read, or a line is wrong; the message starts with {@code file:line:}
   */
  public static SafetyPolicy load(Path file) throws IOException {
    return PolicyFile.read(file);
  }

  /**
   * A copy whose human-only answer groups are exactly {@code groupIds}, replacing any the policy had, so that a
   * manager can also take a mark away. To add to the current marks, pass them together with
   * {@link #humanOnlyGroups()}.
   */
  public SafetyPolicy withHumanOnlyGroups(Set<String> groupIds) {
    return new SafetyPolicy(rules, groupIds, humanOnlyCategories, emergencyLine);
  }

  /**
   * Why the ticket must go to a person, or empty if Precedent may answer it. When term rules match, the finding
   * names the first in precedence and lists them all, and its caution holds every matched topic's text.
   *
   * @param question the customer's question, cleaned and redacted
   * @param category the ticket's category, or null when not yet known
   * @param answerGroupId the proposed answer group, or null when there is none
   */
  public Optional<SafetyFinding> check(String question, String category, String answerGroupId) {
    Objects.requireNonNull(question, "question");
    List<SafetyFinding.Match> matches = matches(prepare(question));
    if (!matches.isEmpty()) {
      SafetyFinding.Match first = matches.get(0);
      String caution = Cautions.combine(matches.stream().map(SafetyFinding.Match::caution).toList());
      return Optional.of(new SafetyFinding(first.ruleId(), first.topic(), first.matched(), SafetyFinding.Kind.TERM,
          caution, matches));
    }
    if (category != null && humanOnlyCategories.contains(Category.key(category))) {
      return Optional.of(new SafetyFinding("human-only-category", "human-only", Category.normalise(category),
          SafetyFinding.Kind.HUMAN_ONLY_CATEGORY, Cautions.general()));
    }
    if (answerGroupId != null && humanOnlyGroups.contains(answerGroupId.strip())) {
      return Optional.of(new SafetyFinding("human-only-group", "human-only", answerGroupId.strip(),
          SafetyFinding.Kind.HUMAN_ONLY_GROUP, Cautions.general()));
    }
    return Optional.empty();
  }

  /** Every rule matching the prepared text, in precedence order: by specificity, then by rule order. */
  private List<SafetyFinding.Match> matches(String text) {
    List<SafetyFinding.Match> found = new ArrayList<>();
    for (SafetyRule.Specificity level : SafetyRule.Specificity.values()) {
      for (SafetyRule rule : rules) {
        if (rule.specificity() != level) {
          continue;
        }
        Matcher m = rule.pattern().matcher(text);
        if (m.find()) {
          found.add(new SafetyFinding.Match(rule.id(), rule.topic(), rule.specificity(), m.group(), rule.caution()));
        }
      }
    }
    return found;
  }

  /** The term rules, in the policy's order, which breaks ties between rules of the same specificity. */
  public List<SafetyRule> rules() {
    return rules;
  }

  /** Answer groups whose answer a person must always send. */
  public Set<String> humanOnlyGroups() {
    return humanOnlyGroups;
  }

  /** Categories, in lower case, whose tickets a person must always answer. */
  public Set<String> humanOnlyCategories() {
    return humanOnlyCategories;
  }

  /** How the cautions name the emergency line, e.g. "our emergency line on 01632 960999". */
  public String emergencyLine() {
    return emergencyLine;
  }

  /**
   * Wraps a rule's pattern so that it matches whole words only and ignores case. The edges are look-arounds rather
   * than {@code \b} so that a pattern may begin or end with any character.
   */
  static Pattern compile(String regex) {
    return Pattern.compile("(?<!\\w)(?:" + regex + ")(?!\\w)", Pattern.CASE_INSENSITIVE | Pattern.UNICODE_CASE);
  }

  static List<SafetyRule> compileDefaults(Set<String> tradePacks, String emergencyLine) {
    List<SafetyRule> out = new ArrayList<>();
    for (DefaultRules.Spec spec : DefaultRules.forPacks(tradePacks)) {
      out.add(new SafetyRule(spec.id(), spec.topic(), spec.specificity(), compile(spec.regex()),
          Cautions.forTopic(spec.topic(), emergencyLine)));
    }
    return out;
  }

  /** One space between words and straight apostrophes, so that patterns need not allow for every spacing. */
  static String prepare(String question) {
    String straight = CURLY_APOSTROPHE.matcher(question).replaceAll("'");
    return SPACE.matcher(straight).replaceAll(" ").strip();
  }

  private static Set<String> frozen(Set<String> ids, boolean lowerCase) {
    Objects.requireNonNull(ids, "ids");
    Set<String> out = new LinkedHashSet<>();
    for (String id : ids) {
      if (id == null || id.isBlank() || SPACE.matcher(id.strip()).find()) {
        throw new IllegalArgumentException("a group or category id must be one word: '" + id + "'");
      }
      out.add(lowerCase ? Category.key(id) : id.strip());
    }
    return Collections.unmodifiableSet(out);
  }
}
