package org.precedent.demo;

import java.time.DayOfWeek;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.time.format.TextStyle;
import java.util.HashMap;
import java.util.Locale;
import java.util.Map;
import java.util.Random;

/**
 * The invented customer and the ordinary details of one ticket, and the filling of {@code {slot}} markers.
 *
 * <p>Dates are drawn a little before the ticket was opened, so that "I moved out on 12/03/2026" in a ticket
 * created in March 2026 reads as it would in a real inbox. Readings, references and amounts are ordinary numbers
 * that cleaning must leave alone, unlike the account number, phone and email.
 */
final class DemoSlots {

  /** Month and day names in English whatever the machine's locale, so that output does not vary by machine. */
  private static final Locale TEXT = Locale.ENGLISH;
  private static final DateTimeFormatter NUMERIC = DateTimeFormatter.ofPattern("dd/MM/yyyy", TEXT);
  private static final DateTimeFormatter NUMERIC_SHORT = DateTimeFormatter.ofPattern("d/M/yy", TEXT);
  private static final DateTimeFormatter MAIL_HEADER = DateTimeFormatter.ofPattern("EEE, d MMM yyyy", Locale.US);

  private static final String[] ORDINALS = {"zeroth", "first", "second", "third", "fourth", "fifth", "sixth"};

  final String first;
  final String last;
  final String account;
  /** The account number as agents write it, whatever form the customer used. */
  final String accountCanonical;
  final String phone;
  final String email;
  final LocalDate opened;
  private final Map<String, String> values = new HashMap<>();

  DemoSlots(Random r, Instant created) {
    opened = LocalDate.ofInstant(created, ZoneOffset.UTC);
    first = DemoPeople.pick(DemoPeople.FIRST_NAMES, r);
    last = DemoPeople.pick(DemoPeople.LAST_NAMES, r);
    String digits = DemoPeople.accountDigits(r);
    account = DemoPeople.formatAccount(digits, r);
    accountCanonical = "TVW-" + digits;
    phone = DemoPeople.phone(r);
    email = DemoPeople.email(first, last, r);
    LocalDate earlier = opened.minusDays(1 + r.nextInt(20));
    values.put("first", first);
    values.put("last", last);
    values.put("account", account);
    values.put("phone", phone);
    values.put("email", email);
    values.put("date", r.nextInt(6) == 0 ? NUMERIC_SHORT.format(earlier) : NUMERIC.format(earlier));
    values.put("dayMonth", dayMonth(opened.minusDays(1 + r.nextInt(25)), r));
    values.put("month", opened.minusMonths(1).getMonth().getDisplayName(TextStyle.FULL, TEXT));
    values.put("weekday", DayOfWeek.of(1 + r.nextInt(5)).getDisplayName(TextStyle.FULL, TEXT));
    int usual = 25 + r.nextInt(90);
    values.put("amount", money(usual * (1.6 + r.nextDouble() * 2.5)));
    values.put("amount2", money(usual + r.nextInt(100) / 100.0));
    int reading = 200 + r.nextInt(9000);
    values.put("reading", String.format(Locale.ROOT, "%05d", reading));
    values.put("reading2", String.format(Locale.ROOT, "%05d", reading - 20 - r.nextInt(180)));
    values.put("ref", Integer.toString(10_000 + r.nextInt(90_000)));
    values.put("house", Integer.toString(1 + r.nextInt(r.nextBoolean() ? 40 : 160)));
    values.put("street", DemoPeople.pick(DemoPeople.STREETS, r));
    values.put("town", DemoPeople.pick(DemoPeople.TOWNS, r));
    values.put("postcode", DemoPeople.postcode(r));
    values.put("years", Integer.toString(2 + r.nextInt(24)));
    values.put("age", Integer.toString(78 + r.nextInt(17)));
    int n = 2 + r.nextInt(5);
    values.put("n", Integer.toString(n));
    values.put("nth", ORDINALS[n]);
  }

  String get(String slot) {
    String v = values.get(slot);
    if (v == null) {
      throw new IllegalArgumentException("unknown slot {" + slot + "}");
    }
    return v;
  }

  void put(String slot, String value) {
    values.put(slot, value);
  }

  /** Replaces every {@code {slot}} with this ticket's value; an unknown slot is a catalogue bug, so it throws. */
  String fill(String template) {
    StringBuilder out = new StringBuilder(template.length() + 32);
    int i = 0;
    while (i < template.length()) {
      char c = template.charAt(i);
      int close = c == '{' ? template.indexOf('}', i) : -1;
      if (close > i) {
        out.append(get(template.substring(i + 1, close)));
        i = close + 1;
      } else {
        out.append(c);
        i++;
      }
    }
    return out.toString();
  }

  /** "Tue, 3 Mar 2026", as mail programs head a quoted message. */
  static String mailDate(LocalDate day) {
    return MAIL_HEADER.format(day);
  }

  static String numericDate(LocalDate day) {
    return NUMERIC.format(day);
  }

  /** "3 March" or "3rd March": customers and agents write both. */
  static String dayMonth(LocalDate day, Random r) {
    int d = day.getDayOfMonth();
    String month = day.getMonth().getDisplayName(TextStyle.FULL, TEXT);
    if (r.nextInt(3) > 0) {
      return d + " " + month;
    }
    String suffix = d % 10 == 1 && d != 11 ? "st" : d % 10 == 2 && d != 12 ? "nd" : d % 10 == 3 && d != 13 ? "rd" : "th";
    return d + suffix + " " + month;
  }

  static String money(double pounds) {
    return "£" + String.format(Locale.ROOT, "%.2f", pounds);
  }
}
