package org.precedent.knowledge.clean;

import java.util.ArrayList;
import java.util.List;
import java.util.function.Predicate;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Web addresses: a customer's (a photo of their meter, their own shop, a tracking link) becomes
 * {@link Placeholders#URL}; the organisation's own ({@link OwnDetails#keepsUrl}) stays. An address
 * is a URI with an authority (RFC 3986 section 3: {@code scheme "://" authority path ["?" query]
 * ["#" fragment]}), any scheme, or a host written from {@code www.} without one, as people write
 * them. URIs without an authority hold no address of a site: {@code mailto:} and {@code tel:}
 * carry an e-mail address or a phone number, which their own rules redact; {@code news:} and
 * {@code urn:} name no one.
 */
final class UrlRule implements Redactor.Rule {
  // RFC 3986 section 3.1: scheme = ALPHA *( ALPHA / DIGIT / "+" / "-" / "." ). The characters that
  // follow are those section 2 allows in a URI: unreserved (2.3), gen-delims and sub-delims (2.2),
  // and "%" of a percent-encoding (2.1). Not after a letter, digit or '@': "joe@www.example.org"
  // is an e-mail address, and a scheme does not start inside a word. Possessive and bounded, so
  // the match is linear in the text.
  private static final String URI_CHARS = "[A-Za-z0-9\\-._~:/?#\\[\\]@!$&'()*+,;=%]";
  static final Pattern URL = Pattern.compile("(?<![A-Za-z0-9+.@_%-])"
      + "(?:[A-Za-z][A-Za-z0-9+.-]{0,31}+://|(?i:www)\\.(?=[A-Za-z0-9]))" + URI_CHARS
      + "{1,2048}+");
  private static final Pattern WHOLE = Pattern.compile(
      "(?:[A-Za-z][A-Za-z0-9+.-]{0,31}+://|(?i:www)\\.)[A-Za-z0-9\\[]" + URI_CHARS + "{0,2047}+");

  private final Predicate<String> keep;

  UrlRule(Predicate<String> keep) {
    this.keep = keep;
  }

  /** Whether all of {@code s} is one web address, as the rule finds them. */
  static boolean isUrl(String s) {
    return WHOLE.matcher(s).matches() && trimmed(s).equals(s) && hasHost(s);
  }

  /** Every web address in {@code text}, as written, in order. */
  static List<String> matches(String text) {
    List<String> found = new ArrayList<>();
    if (mayHold(text)) {
      Matcher m = URL.matcher(text);
      while (m.find()) {
        String url = trimmed(m.group());
        if (hasHost(url)) {
          found.add(url);
        }
      }
    }
    return found;
  }

  @Override
  public String apply(String text) {
    if (!mayHold(text)) {
      return text;
    }
    Matcher m = URL.matcher(text);
    StringBuilder out = new StringBuilder(text.length());
    int at = 0;
    while (m.find()) {
      String url = trimmed(m.group());
      if (!hasHost(url) || keep.test(url)) {
        continue;
      }
      out.append(text, at, m.start()).append(Placeholders.URL);
      at = m.start() + url.length();
    }
    return at == 0 ? text : out.append(text, at, text.length()).toString();
  }

  private static boolean mayHold(String text) {
    return text.contains("://") || Scan.containsIgnoreCase(text, "www.");
  }

  /**
   * Without what closes the sentence around it: a final full stop, comma, colon, semicolon,
   * question or exclamation mark or quote, and a closing bracket that opened before the address
   * (common practice, no source: RFC 3986 appendix C leaves delimiting a URI in text to the text).
   */
  static String trimmed(String url) {
    int opened = 0;
    int closed = 0;
    int openedSquare = 0;
    int closedSquare = 0;
    for (int i = 0; i < url.length(); i++) {
      switch (url.charAt(i)) {
        case '(' -> opened++;
        case ')' -> closed++;
        case '[' -> openedSquare++;
        case ']' -> closedSquare++;
        default -> { }
      }
    }
    int end = url.length();
    while (end > 0) {
      char c = url.charAt(end - 1);
      if (".,;:!?'".indexOf(c) >= 0) {
        end--;
      } else if (c == ')' && opened < closed) {
        closed--;
        end--;
      } else if (c == ']' && openedSquare < closedSquare) {
        closedSquare--;
        end--;
      } else {
        break;
      }
    }
    return url.substring(0, end);
  }

  /** Something after the scheme's "//" or the "www.": a scheme alone names no site. */
  private static boolean hasHost(String url) {
    int slashes = url.indexOf("://");
    int start = slashes >= 0 ? slashes + 3 : 4;
    return start < url.length() && url.charAt(start) != '/';
  }
}
