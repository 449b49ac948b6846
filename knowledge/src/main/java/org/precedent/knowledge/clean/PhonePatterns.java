package org.precedent.knowledge.clean;

import java.util.regex.Pattern;

/**
 * Phone-number shapes. Each is anchored by look-arounds so that it cannot start or stop inside a
 * longer number, and each demands a full digit count so that dates, amounts, ticket references and
 * meter readings (which are shorter, or lack the leading 0 / '+') are left alone.
 */
final class PhonePatterns {
  private PhonePatterns() {}

  /**
   * International form: '+', then 8 to 15 digits (ITU-T E.164 caps the number at 15 digits; 8 is
   * this project's floor, below which '+' is more likely a sign than a country code). Spaces, dots,
   * hyphens and parentheses may sit between digits, at most two together, as in "+44 (0)20 ...".
   */
  static final Pattern E164 =
      Pattern.compile("(?<![\\w+])\\+\\d(?:[ .()-]{0,2}\\d){7,14}(?![ -]?\\d)");

  /**
   * UK national form: a leading 0 and ten or eleven digits in all, in the layouts UK numbers are
   * printed in (5+6, 4+7 or 4+6, 3+8, or unbroken). The first digit after the area code may not
   * be 0, which keeps two zero-padded meter readings side by side ("04821 05113") from matching.
   */
  static final Pattern UK_NATIONAL = Pattern.compile(
      "(?<![\\w+/.,#£$€-])(?:"
          + "(?:\\(0\\d{4}\\)|0\\d{4})[ -]?[1-9]\\d{2}[ -]?\\d{3}"
          + "|(?:\\(0\\d{3}\\)|0\\d{3})[ -]?[1-9]\\d{2}[ -]?\\d{3,4}"
          + "|(?:\\(0\\d{2}\\)|0\\d{2})[ -]?[1-9]\\d{3}[ -]?\\d{4}"
          + "|0[1-9]\\d{8,9}"
          + ")(?![ -]?\\d)");

  /**
   * North American Numbering Plan: area code and exchange each start with 2-9, written
   * "(555) 555-0123" or "555-555-0123" / "555.555.0123", with an optional leading "1-". Numbers
   * written with spaces only ("555 555 0123") are left alone: too close to three plain numbers.
   */
  static final Pattern NANP = Pattern.compile(
      "(?<![\\w+/.,#-])(?:1[ .-]?)?(?:\\([2-9]\\d{2}\\)[ .-]?|[2-9]\\d{2}[.-])[2-9]\\d{2}[.-]\\d{4}(?![.-]?\\d)");
}
