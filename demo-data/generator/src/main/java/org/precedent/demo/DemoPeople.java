package org.precedent.demo;

import java.util.List;
import java.util.Locale;
import java.util.Random;

/**
 * Invented people and places of the Tarnwick Vale scenario, and the personal data formats customers write.
 *
 * <p>Every phone number falls in a range reserved for fiction (01632 960xxx, 07700 900xxx), every email domain
 * is reserved or invented, and account numbers use the utility's own {@code TVW} format, so that nothing here can
 * reach a real person.
 */
final class DemoPeople {

  static final List<String> FIRST_NAMES = List.of(
      "Priya", "Tom", "Dana", "Olu", "Megan", "Harjit", "Siobhan", "Gareth", "Aisha", "Callum", "Beata", "Rhys",
      "Yusuf", "Fiona", "Kwame", "Lorna", "Mateusz", "Imogen", "Declan", "Nadia", "Ewan", "Grace", "Tariq", "Hollie",
      "Wei", "Bronwen", "Marcus", "Ayesha", "Stuart", "Carys", "Jonah", "Delphine", "Ravi", "Maureen", "Kieran",
      "Zofia", "Len", "Abigail", "Femi", "Rosalind", "Dev", "Noreen", "Oskar", "Jas", "Hamish", "Tanisha", "Bill",
      "Ingrid", "Sunil", "Margo", "Patrick", "Leah", "Adebayo", "Elspeth", "Connor", "Mina", "Graham", "Shona",
      "Arjun", "Trudy");

  static final List<String> LAST_NAMES = List.of(
      "Fairley", "Okonjo", "Mistry", "Haldane", "Pryce", "Baskerfield", "Quennell", "Adeyemi", "Lowther", "Sandhu",
      "Kowalczyk", "Trevethan", "Ashdown", "Ward-Ennis", "Greaves", "Tolland", "Cheung", "Harcourt", "Dervish",
      "Nuttall", "Ferreira", "Blaydon", "Oyelaran", "McAlister", "Penhallow", "Rashid", "Whitlock", "Iqbal", "Gunn",
      "Lindqvist", "Morcombe", "Achterberg", "Brindley", "Osei", "Fenwick", "Varga", "Stainton", "Kaur", "Hebden",
      "Duckett", "Pillai", "Royle", "Abernethy", "Szabo", "Catterall", "Nwosu", "Elphick", "Jaworski", "Tamblyn",
      "Wragg");

  /** Agents of the utility's customer care team; each has habits of greeting and signing. */
  static final List<String> AGENTS = List.of(
      "Sam", "Jo", "Ashok", "Bethan", "Marek", "Lucy", "Desmond", "Farah", "Owen", "Kirsty", "Tunde", "Helena",
      "Niamh", "Pete");

  static final List<String> STREETS = List.of(
      "Millrace Lane", "Cobbold Road", "Heronsgate Close", "Tarn View", "Wheelwright Way", "Saxby Street",
      "Linnet Drive", "Fennimore Gardens", "Kestrel Court", "Old Quarry Road", "Brookside Terrace", "Sallow Walk",
      "Pennycress Avenue", "Castlegate", "Weir Street", "Tanners Row", "Hobb's Lane", "Ferryman Close",
      "Goldthorpe Road", "Malting Yard", "Larch Crescent", "Reservoir Road", "Brackenhill", "St Ebba's Place",
      "Cowslip Meadow", "Dyers Hill", "Tolgate Mews", "Vale Parade");

  static final List<String> TOWNS = List.of(
      "Tarnwick", "Tarnwick", "Tarnwick", "Elsby Marsh", "Hobb's Cross", "Netherfold", "Upper Calden", "Wrayford",
      "Ashby Tarn", "Kellingbeck");

  static final List<String> EMAIL_DOMAINS = List.of(
      "example.com", "example.org", "example.net", "mailbox.example", "post.example", "valenet.example");

  /** Inward-code letters of a UK-style postcode never include these, so the invented codes still look right. */
  private static final String POSTCODE_LETTERS = "ABDEFGHJLNPQRSTUWXYZ";

  private DemoPeople() {
  }

  static String accountDigits(Random r) {
    return Integer.toString(10_000_000 + r.nextInt(90_000_000));
  }

  /** The many ways customers write an account number, all of which cleaning must still recognise. */
  static String formatAccount(String digits, Random r) {
    int form = r.nextInt(20);
    if (form < 9) {
      return "TVW-" + digits;
    } else if (form < 13) {
      return "TVW " + digits;
    } else if (form < 16) {
      return "TVW" + digits;
    } else if (form < 18) {
      return "tvw " + digits;
    } else if (form < 19) {
      return "tvw-" + digits;
    }
    return "Tvw" + digits;
  }

  static String phone(Random r) {
    String n = String.format(Locale.ROOT, "%03d", r.nextInt(1000));
    return switch (r.nextInt(9)) {
      case 0, 1 -> "07700 900" + n;
      case 2 -> "+44 7700 900" + n;
      case 3 -> "07700900" + n;
      case 4 -> "+447700 900" + n;
      case 5 -> "01632 960" + n;
      case 6 -> "01632 960 " + n;
      case 7 -> "(01632) 960" + n;
      default -> "07700 900 " + n;
    };
  }

  static String email(String first, String last, Random r) {
    String f = first.toLowerCase(Locale.ROOT);
    String l = last.toLowerCase(Locale.ROOT).replace("-", "").replace("'", "");
    String domain = pick(EMAIL_DOMAINS, r);
    return switch (r.nextInt(5)) {
      case 0 -> f + "." + l + "@" + domain;
      case 1 -> f.charAt(0) + l + "@" + domain;
      case 2 -> f + l + (10 + r.nextInt(89)) + "@" + domain;
      case 3 -> f + "_" + l.charAt(0) + "@" + domain;
      default -> l + "." + f + "@" + domain;
    };
  }

  /** An invented postcode in the fictional TV area, shaped like a real UK one (for example TV3 7QX). */
  static String postcode(Random r) {
    return "TV" + (1 + r.nextInt(12)) + " " + r.nextInt(10)
        + POSTCODE_LETTERS.charAt(r.nextInt(POSTCODE_LETTERS.length()))
        + POSTCODE_LETTERS.charAt(r.nextInt(POSTCODE_LETTERS.length()));
  }

  static <T> T pick(List<T> items, Random r) {
    return items.get(r.nextInt(items.size()));
  }
}
