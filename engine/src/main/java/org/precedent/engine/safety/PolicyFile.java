package org.precedent.engine.safety;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;
import java.util.regex.PatternSyntaxException;

/**
 * Reads a policy file, as described in the package description. The whole file is checked before anything is
 * built, and the first wrong line stops the load, so a bad file never yields a policy with some rules missing.
 */
final class PolicyFile {

  private static final String EMERGENCY_PREFIX = "our emergency line on ";

  private final String source;
  private String emergencyNumber;
  private Boolean includeDefaults;
  private Set<String> tradePacks;
  private int tradePacksLine;
  private final Set<String> categories = new LinkedHashSet<>();
  private final Set<String> groups = new LinkedHashSet<>();
  private final Map<String, FileRule> rules = new LinkedHashMap<>();
  private final Map<String, FileCaution> cautions = new LinkedHashMap<>();

  private record FileRule(String id, String topic, SafetyRule.Specificity specificity, Pattern pattern) {
  }

  private record FileCaution(String text, int line) {
  }

  private PolicyFile(String source) {
    this.source = source;
  }

  static SafetyPolicy read(Path file) throws IOException {
    return parse(Files.readAllLines(file, StandardCharsets.UTF_8), file.toString());
  }

  /** Parses the lines of a file; {@code source} names it in error messages. */
  static SafetyPolicy parse(List<String> lines, String source) throws IOException {
    PolicyFile f = new PolicyFile(source);
    for (int i = 0; i < lines.size(); i++) {
      String line = lines.get(i).strip();
      if (i == 0 && line.startsWith("\uFEFF")) {
        line = line.substring(1).strip();
      }
      if (!line.isEmpty() && !line.startsWith("#")) {
        f.readLine(line, i + 1);
      }
    }
    return f.build();
  }

  private void readLine(String line, int no) throws IOException {
    if (line.startsWith("rule ")) {
      readRule(line.substring(5), no);
    } else if (line.startsWith("caution ")) {
      readCaution(line.substring(8), no);
    } else {
      int eq = line.indexOf('=');
      if (eq < 0) {
        throw error(no, "expected 'setting = value', 'rule ...' or 'caution ...', found: " + line);
      }
      readSetting(line.substring(0, eq).strip(), line.substring(eq + 1).strip(), no);
    }
  }

  private void readSetting(String key, String value, int no) throws IOException {
    if (value.isEmpty()) {
      throw error(no, key + " needs a value");
    }
    switch (key) {
      case "emergency-line" -> {
        if (emergencyNumber != null) {
          throw error(no, "emergency-line is given twice");
        }
        emergencyNumber = value;
      }
      case "include-defaults" -> {
        if (includeDefaults != null) {
          throw error(no, "include-defaults is given twice");
        }
        if (!value.equals("true") && !value.equals("false")) {
          throw error(no, "include-defaults must be true or false, found: " + value);
        }
        includeDefaults = Boolean.valueOf(value);
      }
      case "trade-packs" -> readTradePacks(value, no);
      case "human-only-category" -> categories.add(id(value, "category", no));
      case "human-only-group" -> groups.add(id(value, "group", no));
      default -> throw error(no, "unknown setting '" + key + "'");
    }
  }

  /** {@code trade-packs = <pack>, <pack>} or {@code trade-packs = none}: the packs added to the general part. */
  private void readTradePacks(String value, int no) throws IOException {
    if (tradePacks != null) {
      throw error(no, "trade-packs is given twice");
    }
    Set<String> packs = new LinkedHashSet<>();
    if (!value.equals("none")) {
      for (String part : value.split(",", -1)) {
        String pack = part.strip();
        if (!DefaultRules.TRADE_PACKS.contains(pack)) {
          throw error(no, "unknown trade pack '" + pack + "'; known: " + String.join(", ",
              DefaultRules.TRADE_PACKS.stream().sorted().toList()) + ", or none");
        }
        if (!packs.add(pack)) {
          throw error(no, "trade pack " + pack + " is named twice");
        }
      }
    }
    tradePacks = packs;
    tradePacksLine = no;
  }

  /**
   * {@code rule <id> [situation|sign] | <topic> | <pattern>}; the pattern is the rest of the line, so it may hold
   * '|'. Without a specificity word the rule names a situation, as a help desk's own rule usually does.
   */
  private void readRule(String rest, int no) throws IOException {
    String[] parts = rest.split("\\|", 3);
    if (parts.length < 3 || parts[2].isBlank()) {
      throw error(no, "expected 'rule <id> | <topic> | <pattern>', or 'rule <id> sign | <topic> | <pattern>' for a "
          + "rule that names only a sign");
    }
    String[] head = parts[0].strip().split(" +");
    String id = name(head[0], "rule id", no);
    SafetyRule.Specificity specificity = SafetyRule.Specificity.SITUATION;
    if (head.length == 2) {
      specificity = specificity(head[1], id, no);
    } else if (head.length > 2) {
      throw error(no, "rule id must be one word, optionally followed by situation or sign, found: '"
          + parts[0].strip() + "'");
    }
    String topic = name(parts[1].strip(), "topic", no);
    if (rules.containsKey(id)) {
      throw error(no, "rule " + id + " is defined twice");
    }
    String regex = parts[2].strip();
    try {
      rules.put(id, new FileRule(id, topic, specificity, SafetyPolicy.compile(regex)));
    } catch (PatternSyntaxException e) {
      throw error(no, "bad pattern for rule " + id + ": " + e.getDescription() + " near index " + e.getIndex()
          + " of '" + regex + "'");
    }
  }

  /** {@code caution <topic> | <text>}; the closing sentence is added to the text, as for built-in cautions. */
  private void readCaution(String rest, int no) throws IOException {
    int bar = rest.indexOf('|');
    if (bar < 0 || rest.substring(bar + 1).isBlank()) {
      throw error(no, "expected 'caution <topic> | <text>'");
    }
    String topic = name(rest.substring(0, bar).strip(), "topic", no);
    if (cautions.containsKey(topic)) {
      throw error(no, "caution for topic " + topic + " is given twice");
    }
    cautions.put(topic, new FileCaution(rest.substring(bar + 1).strip(), no));
  }

  private SafetyPolicy build() throws IOException {
    String line = emergencyNumber == null ? Cautions.DEFAULT_EMERGENCY_LINE : EMERGENCY_PREFIX + emergencyNumber;
    boolean defaults = includeDefaults == null || includeDefaults;
    if (!defaults && tradePacks != null) {
      throw error(tradePacksLine, "trade-packs chooses built-in rules, but include-defaults is false");
    }
    // Without trade-packs, every pack: the same reasons as SafetyPolicy.defaults(), and older files keep their rules.
    Set<String> packs = tradePacks == null ? DefaultRules.TRADE_PACKS : tradePacks;
    // A rule from the file replaces a built-in rule of the same id in its place; new ids come after.
    Map<String, FileRule> merged = new LinkedHashMap<>();
    if (defaults) {
      for (DefaultRules.Spec spec : DefaultRules.forPacks(packs)) {
        merged.put(spec.id(), new FileRule(spec.id(), spec.topic(), spec.specificity(),
            SafetyPolicy.compile(spec.regex())));
      }
    }
    merged.putAll(rules);
    Set<String> topics = new LinkedHashSet<>();
    merged.values().forEach(r -> topics.add(r.topic()));
    for (Map.Entry<String, FileCaution> c : cautions.entrySet()) {
      if (!topics.contains(c.getKey())) {
        throw error(c.getValue().line(), "caution for topic " + c.getKey() + ", but no rule has that topic");
      }
    }
    List<SafetyRule> built = new ArrayList<>();
    for (FileRule r : merged.values()) {
      FileCaution own = cautions.get(r.topic());
      String caution = own != null ? Cautions.compose(own.text(), line) : Cautions.forTopic(r.topic(), line);
      built.add(new SafetyRule(r.id(), r.topic(), r.specificity(), r.pattern(), caution));
    }
    return new SafetyPolicy(built, groups, categories, line);
  }

  private String name(String value, String what, int no) throws IOException {
    if (!SafetyRule.isName(value)) {
      throw error(no, what + " must be lower-case letters, digits, '.', '_' or '-', found: '" + value + "'");
    }
    return value;
  }

  private SafetyRule.Specificity specificity(String word, String id, int no) throws IOException {
    for (SafetyRule.Specificity s : SafetyRule.Specificity.values()) {
      if (s.word().equals(word)) {
        return s;
      }
    }
    throw error(no, "rule " + id + ": specificity must be situation or sign, found: '" + word + "'");
  }

  private String id(String value, String what, int no) throws IOException {
    if (value.chars().anyMatch(Character::isWhitespace)) {
      throw error(no, "a " + what + " id is one word, found: '" + value + "'");
    }
    return value;
  }

  private IOException error(int line, String message) {
    return new IOException(source + ":" + line + ": " + message);
  }
}
