package org.precedent.knowledge.clean;

import java.util.List;
import java.util.regex.Pattern;

/**
 * Replaces personal data with typed placeholders by running a fixed list of rules in order. The
 * order matters: web addresses go first because they may hold an '@', digits and whole e-mail
 * addresses or numbers in their query (a kept address is still searched by the rules after it, so
 * a customer's number in the query of the organisation's own page is redacted); e-mail addresses
 * next because they may contain digits; IBANs before cards
 * because an IBAN's digits can pass the Luhn check; cards before phones so that a 16-digit card
 * is not read as a phone number; account numbers before phones for the same reason.
 */
final class Redactor {

  /** One kind of personal data. Rules must not match text that spans a line break. */
  interface Rule {
    String apply(String text);
  }

  // RFC 5321 section 4.5.3.1 limits the local part to 64 octets and a domain label to 63. The
  // possessive quantifiers cannot backtrack into characters that never include '@' or '.'.
  private static final Pattern EMAIL = Pattern.compile(
      "(?<![\\w.%+-])[\\w.%+-]{1,64}+@(?:[A-Za-z0-9-]{1,63}+\\.){1,8}[A-Za-z]{2,24}+(?![\\w-])");

  // The demo utility's customer account number: TVW, an optional hyphen or space, eight digits.
  private static final Pattern ACCOUNT =
      Pattern.compile("(?<![A-Za-z0-9])(?i:tvw)[ -]?\\d{8}(?!\\d)");

  private static final UrlRule URLS = new UrlRule(url -> false);
  private static final PatternRule EMAILS =
      new PatternRule(EMAIL, Placeholders.EMAIL, t -> t.indexOf('@') >= 0);
  private static final List<PatternRule> PHONES = List.of(
      new PatternRule(PhonePatterns.E164, Placeholders.PHONE, t -> t.indexOf('+') >= 0),
      new PatternRule(PhonePatterns.UK_NATIONAL, Placeholders.PHONE, t -> Scan.hasDigits(t, 10)),
      new PatternRule(PhonePatterns.NANP, Placeholders.PHONE, t -> Scan.hasDigits(t, 10)));

  private static final Redactor STANDARD = keeping(OwnDetails.NONE);

  private final List<Rule> rules;

  Redactor(List<Rule> rules) {
    this.rules = List.copyOf(rules);
  }

  static Redactor standard() {
    return STANDARD;
  }

  /** Every rule, in order, with the organisation's own e-mail addresses and numbers left alone. */
  static Redactor keeping(OwnDetails own) {
    List<Rule> rules = new java.util.ArrayList<>();
    rules.add(new UrlRule(own::keepsUrl));
    rules.add(EMAILS.keeping(own::keepsEmail));
    rules.add(new IbanRule());
    rules.add(new CardRule());
    rules.add(new PatternRule(ACCOUNT, Placeholders.ACCOUNT, t -> Scan.containsIgnoreCase(t, "tvw")));
    for (PatternRule phone : PHONES) {
      rules.add(phone.keeping(own::keepsPhone));
    }
    return new Redactor(rules);
  }

  /**
   * The web addresses, e-mail addresses and phone numbers in {@code text}, as written, in the order
   * the rules find them; what redaction would replace, unless kept.
   */
  static List<String> contacts(String text) {
    List<String> found = new java.util.ArrayList<>(UrlRule.matches(text));
    String rest = URLS.apply(text);
    found.addAll(EMAILS.matches(rest));
    rest = EMAILS.apply(rest);
    for (PatternRule phone : PHONES) {
      found.addAll(phone.matches(rest));
      rest = phone.apply(rest);
    }
    return found;
  }

  String redact(String text) {
    String out = text;
    for (Rule rule : rules) {
      out = rule.apply(out);
    }
    return out;
  }
}
