package org.precedent.knowledge.clean;

import java.io.IOException;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;

/**
 * The organisation's own contact details: phone numbers, e-mail addresses and web addresses that
 * its agents give every customer (a 24-hour line, a help-desk address, the page to pay a bill).
 * Redaction leaves them in place, so that an answer saying "call our 24-hour line on ..." keeps its
 * number; a customer's details are redacted as before.
 *
 * <p>The file ({@code DIR/own-details.txt}) holds one detail a line, {@code phone VALUE}, {@code
 * email VALUE} or {@code url VALUE}; {@code #} starts a comment. A phone number is compared by its
 * digits alone, so "01632 960999" also keeps "01632-960999"; an e-mail address is compared
 * ignoring case; a web address keeps every address on the same site at or below its path, in any
 * scheme ({@link #urlKey}).
 *
 * @param phones the digits of each phone number kept
 * @param emails each e-mail address kept, lower-case
 * @param urls   each web address kept, as {@link #urlKey} writes it
 */
public record OwnDetails(Set<String> phones, Set<String> emails, Set<String> urls) {
  /** No details kept: everything that looks like a contact detail is redacted. */
  public static final OwnDetails NONE = new OwnDetails(Set.of(), Set.of(), Set.of());
  private static final int MAX_LINE = 320;

  public OwnDetails {
    phones = Set.copyOf(phones);
    emails = Set.copyOf(emails);
    urls = Set.copyOf(urls);
  }

  /** Phone numbers and e-mail addresses only. */
  public OwnDetails(Set<String> phones, Set<String> emails) {
    this(phones, emails, Set.of());
  }

  /**
   * Whether {@code url}, as found in a text, is on one of the organisation's sites: the same host
   * at or below a kept path (segment by segment, so {@code /pay} keeps {@code /pay/direct-debit}
   * and not {@code /payments}).
   */
  public boolean keepsUrl(String url) {
    if (urls.isEmpty()) {
      return false;
    }
    String key = urlKey(url);
    for (String kept : urls) {
      if (key.equals(kept) || key.startsWith(kept + "/")) {
        return true;
      }
    }
    return false;
  }

  /**
   * A web address as two are compared: host and path, without the scheme, user information,
   * port, query, fragment, a leading {@code www.} or a final {@code /}, the host in lower case.
   * RFC 3986 section 6.2.2.1 makes scheme and host case-insensitive and the path not; the scheme
   * is dropped so that one site's http and https addresses are one.
   */
  public static String urlKey(String url) {
    String rest = url;
    int scheme = rest.indexOf("://");
    if (scheme >= 0) {
      rest = rest.substring(scheme + 3);
    }
    int pathStart = firstOf(rest, "/?#");
    String authority = rest.substring(0, pathStart);
    String after = rest.substring(pathStart);
    int userinfo = authority.lastIndexOf('@');
    String host = authority.substring(userinfo + 1);
    int port = host.lastIndexOf(':');
    if (port >= 0 && host.indexOf(']') < port) {
      host = host.substring(0, port);
    }
    host = host.toLowerCase(Locale.ROOT);
    if (host.startsWith("www.")) {
      host = host.substring(4);
    }
    String path = after.substring(0, firstOf(after, "?#"));
    while (path.endsWith("/")) {
      path = path.substring(0, path.length() - 1);
    }
    return host + path;
  }

  private static int firstOf(String s, String chars) {
    for (int i = 0; i < s.length(); i++) {
      if (chars.indexOf(s.charAt(i)) >= 0) {
        return i;
      }
    }
    return s.length();
  }

  /** Whether {@code phone}, as found in a text, is one of the organisation's numbers. */
  public boolean keepsPhone(String phone) {
    return !phones.isEmpty() && phones.contains(digits(phone));
  }

  /** Whether {@code email}, as found in a text, is one of the organisation's addresses. */
  public boolean keepsEmail(String email) {
    return !emails.isEmpty() && emails.contains(email.toLowerCase(Locale.ROOT));
  }

  /**
   * The form two contact details are compared in: a web address by {@link #urlKey}, an e-mail
   * address in lower case, a phone number by its digits alone, so that {@code 01632 960999} and
   * {@code 01632-960-999} are one number.
   */
  public static String key(String written) {
    return switch (kind(written)) {
      case "url" -> "url " + urlKey(written);
      case "email" -> written.toLowerCase(Locale.ROOT);
      default -> digits(written);
    };
  }

  /** "url", "email" or "phone": what a detail that redaction finds is, as this file names it. */
  public static String kind(String written) {
    if (UrlRule.isUrl(written)) {
      return "url";
    }
    return written.indexOf('@') >= 0 ? "email" : "phone";
  }

  /** Whether nothing is kept. */
  public boolean isEmpty() {
    return phones.isEmpty() && emails.isEmpty() && urls.isEmpty();
  }

  /**
   * Reads {@code file}; a missing file means {@link #NONE}. A bad line is an IOException naming
   * the file and line, so that a typing mistake never silently lets a number be redacted, or kept.
   */
  public static OwnDetails read(Path file) throws IOException {
    List<String> lines;
    try {
      lines = List.of(StandardCharsets.UTF_8.newDecoder()
          .decode(java.nio.ByteBuffer.wrap(Files.readAllBytes(file))).toString().split("\n", -1));
    } catch (NoSuchFileException e) {
      return NONE;
    } catch (CharacterCodingException e) {
      throw new IOException(file + ": not UTF-8 text");
    }
    Set<String> phones = new LinkedHashSet<>();
    Set<String> emails = new LinkedHashSet<>();
    Set<String> urls = new LinkedHashSet<>();
    for (int i = 0; i < lines.size(); i++) {
      String line = lines.get(i).strip();
      String where = file + ":" + (i + 1) + ": ";
      if (line.isEmpty() || line.startsWith("#")) {
        continue;
      }
      if (line.length() > MAX_LINE) {
        throw new IOException(where + "longer than " + MAX_LINE + " characters");
      }
      String[] kindAndValue = line.split("\\s+", 2);
      String value = kindAndValue.length == 2 ? kindAndValue[1].strip() : "";
      switch (kindAndValue[0].toLowerCase(Locale.ROOT)) {
        case "phone" -> {
          String digits = digits(value);
          // E.164 allows at most 15 digits; below 7 a "number" would keep dates and amounts too.
          if (digits.length() < 7 || digits.length() > 15 || !value.matches("[+0-9 ().-]+")) {
            throw new IOException(where + "'" + value + "' is not a phone number (7 to 15 digits, "
                + "with spaces, dots, hyphens, brackets or a leading +)");
          }
          phones.add(digits);
        }
        case "email" -> {
          if (!value.matches("[^@\\s]{1,64}@[^@\\s]{1,255}")) {
            throw new IOException(where + "'" + value + "' is not an e-mail address");
          }
          emails.add(value.toLowerCase(Locale.ROOT));
        }
        case "url" -> {
          if (!UrlRule.isUrl(value)) {
            throw new IOException(where + "'" + value + "' is not a web address (a scheme and "
                + "'://' or 'www.', then the site, as in https://www.example.org/help)");
          }
          urls.add(urlKey(value));
        }
        default -> throw new IOException(where + "expected 'phone VALUE', 'email VALUE' or "
            + "'url VALUE', got '" + kindAndValue[0] + "'");
      }
    }
    return new OwnDetails(phones, emails, urls);
  }

  static String digits(String s) {
    StringBuilder d = new StringBuilder(s.length());
    for (int i = 0; i < s.length(); i++) {
      char c = s.charAt(i);
      if (c >= '0' && c <= '9') {
        d.append(c);
      }
    }
    return d.toString();
  }
}
