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
 * The organisation's own contact details: phone numbers and e-mail addresses that its agents give
 * every customer (a 24-hour line, a help-desk address). Redaction leaves them in place, so that an
 * answer saying "call our 24-hour line on ..." keeps its number; a customer's details are redacted
 * as before. Web addresses are never redacted, so they need no entry.
 *
 * <p>The file ({@code DIR/own-details.txt}) holds one detail a line, {@code phone VALUE} or
 * {@code email VALUE}; {@code #} starts a comment. A phone number is compared by its digits alone,
 * so "01632 960999" also keeps "01632-960999"; an e-mail address is compared ignoring case.
 *
 * @param phones the digits of each phone number kept
 * @param emails each e-mail address kept, lower-case
 */
public record OwnDetails(Set<String> phones, Set<String> emails) {
  /** No details kept: everything that looks like a contact detail is redacted. */
  public static final OwnDetails NONE = new OwnDetails(Set.of(), Set.of());
  private static final int MAX_LINE = 320;

  public OwnDetails {
    phones = Set.copyOf(phones);
    emails = Set.copyOf(emails);
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
   * The form two contact details are compared in: an e-mail address in lower case, a phone number
   * by its digits alone, so that {@code 01632 960999} and {@code 01632-960-999} are one number.
   */
  public static String key(String written) {
    return written.indexOf('@') >= 0 ? written.toLowerCase(Locale.ROOT) : digits(written);
  }

  /** Whether nothing is kept. */
  public boolean isEmpty() {
    return phones.isEmpty() && emails.isEmpty();
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
        default -> throw new IOException(where + "expected 'phone VALUE' or 'email VALUE', got '"
            + kindAndValue[0] + "'");
      }
    }
    return new OwnDetails(phones, emails);
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
