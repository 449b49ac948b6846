package org.precedent.demo;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.Set;

/**
 * Tickets whose reply is written for that ticket alone: formal complaints, solicitors' letters, claims and odd
 * cases. They have no reusable answer, so the product should hand them to a person rather than propose a reply.
 *
 * <p>Each reply is assembled from case-specific acknowledgements, findings and actions filled with the ticket's
 * own names, dates, places and sums, so no two one-off replies read alike, and each gets its own answer key.
 */
final class DemoOneOffs {

  static final String KEY_PREFIX = "oneoff-";

  /**
   * One kind of individual case. Customer text is built from {@code situations} and {@code asks}; the reply from
   * {@code acks}, {@code findings} and {@code actions}, all coherent with the case.
   */
  record Case(String category, String topic, List<String> subjects, List<String> situations, List<String> asks,
      List<String> acks, List<String> findings, List<String> actions) {
  }

  /**
   * A composed one-off: the core of the customer's message, the individual reply text, and whether the sender
   * writes a formal letter (with the signature block of a firm, when a firm writes).
   */
  record OneOff(String category, String subject, String question, String reply, boolean letter, String signature) {
  }

  private static final List<Case> CASES = build();

  private static final List<String> MANAGERS = List.of(
      "Gail Hembrow", "Raj Bhattacharya", "Colin Ferriby", "Yvonne Ashworth", "Mark Delaney", "Ruth Okafor-Lane");
  private static final List<String> FIRMS = List.of(
      "Fettle & Crane Solicitors", "Brackenbury Vane LLP", "Osgood Tarrant Law", "Pellow Hart & Co",
      "Quarrendon Legal");
  private static final List<String> INSURERS = List.of(
      "Kingsmere Home Insurance", "Northfold Assurance", "Vale Mutual Insurance");
  private static final List<String> BINS = List.of(
      "grey bin", "blue recycling bin", "food caddy", "green garden waste bin", "glass box");
  private static final List<String> ITEMS = List.of(
      "garden wall", "fence panel", "gatepost", "car's wing mirror", "front hedge", "bin store", "block-paved drive");
  private static final List<String> ISSUES = List.of(
      "billing dispute", "leak allowance claim", "meter exchange", "blocked drain", "refund", "payment plan",
      "low pressure problem");

  private static final List<String> COMPLAINT_OPENERS = List.of(
      "Thank you for your email about {topic}, which I've looked into as a formal complaint.",
      "I'm the member of our Customer Relations Team looking after your complaint, and I wanted to reply to you personally.",
      "Thank you for taking the time to write to us, and for your patience while I investigated.",
      "I'm writing in response to your complaint received on {dayMonth}.");
  private static final List<String> COMPLAINT_CLOSINGS = List.of(
      "If you're not happy with this response, you can ask for it to be reviewed by our Head of Customer Relations by replying within 28 days.",
      "I hope this goes some way to putting things right. If you'd like to discuss it, you can reply to me directly and I'll call you.",
      "Please quote reference {caseRef} if you need to get back in touch, and it will come straight to me.",
      "If you remain unhappy once you've read this, you're entitled to refer your complaint for an independent review, and I can send you details.");
  private static final List<String> LEGAL_OPENERS = List.of(
      "Thank you for your letter dated {dayMonth}.", "We acknowledge receipt of your correspondence of {dayMonth}.",
      "Thank you for your email, which has been passed to the Legal and Insurance Team.");
  private static final List<String> LEGAL_CLOSINGS = List.of(
      "Please direct any further correspondence on this matter to this team, quoting reference {caseRef}.",
      "Nothing in this letter is an admission of liability. Please quote reference {caseRef} in any reply.",
      "We will write again once our enquiries are complete. Our reference is {caseRef}.");
  private static final List<String> OTHER_CLOSINGS = List.of(
      "Thanks again for getting in touch.", "It's not every day we get an email like yours, so thank you.",
      "Do let us know how you get on.", "If there's anything else, just reply to this email.", "");

  /** Sentences that tie a reply to this customer and this case, so replies to similar cases still differ. */
  private static final List<String> COMPLAINT_PERSONAL = List.of(
      "I've read your email of {dayMonth} carefully, including what you said about {street}.",
      "I've also spoken to {manager}, who oversees the team concerned.",
      "I've gone through every contact on your account since {month} to make sure I had the full picture.",
      "I know you've had to contact us more than once, and I appreciate you giving us the chance to put this right.",
      "Our records for {house} {street} now include a note of everything set out here.",
      "I understand this has been going on for {weeks} weeks, which is far too long.");
  private static final List<String> LEGAL_PERSONAL = List.of(
      "Our records for {house} {street} have been retrieved and are being reviewed.",
      "We have noted the contents of your correspondence and the enclosures referred to.",
      "The matter has been allocated to {manager} in our Legal and Insurance Team.",
      "We have checked our records for {street}, {town} for the period in question.");
  private static final List<String> OTHER_PERSONAL = List.of(
      "I've made a note on the record for {house} {street} in case you need to refer to this again.",
      "I checked with {manager} before replying, so that you get the right answer first time.",
      "We don't get many emails like yours from {town}, so it's been a pleasure to look into.",
      "I've also let our team in {town} know, as they cover {street}.");

  private DemoOneOffs() {
  }

  static List<Case> cases() {
    return CASES;
  }

  static String key(int ticketNumber) {
    return KEY_PREFIX + String.format(Locale.ROOT, "%06d", ticketNumber);
  }

  /** Composes one individual case; complaints are the most common, odd cases next, legal letters the rarest. */
  static OneOff compose(DemoSlots s, Random r) {
    int roll = r.nextInt(100);
    String category = roll < 50 ? "complaint" : roll < 72 ? "legal" : "other";
    List<Case> pool = CASES.stream().filter(c -> c.category().equals(category)).toList();
    Case c = DemoPeople.pick(pool, r);
    s.put("manager", DemoPeople.pick(MANAGERS, r));
    s.put("firm", DemoPeople.pick(FIRMS, r));
    s.put("insurer", DemoPeople.pick(INSURERS, r));
    s.put("bin", DemoPeople.pick(BINS, r));
    s.put("item", DemoPeople.pick(ITEMS, r));
    s.put("issue", DemoPeople.pick(ISSUES, r));
    s.put("client", DemoPeople.pick(DemoPeople.FIRST_NAMES, r) + " " + DemoPeople.pick(DemoPeople.LAST_NAMES, r));
    s.put("goodwill", "£" + (20 + 5 * r.nextInt(13)));
    s.put("claim", DemoSlots.money(180 + r.nextInt(8000) + r.nextInt(100) / 100.0));
    s.put("refund", DemoSlots.money(35 + r.nextInt(400) + r.nextInt(100) / 100.0));
    s.put("caseRef", "CR-" + (100_000 + r.nextInt(900_000)));
    s.put("weeks", Integer.toString(2 + r.nextInt(7)));
    s.put("visitDate", DemoSlots.dayMonth(s.opened.plusDays(3 + r.nextInt(18)), r));
    s.put("topic", s.fill(c.topic()));

    List<String> ask = new ArrayList<>();
    ask.add(s.fill(DemoPeople.pick(c.situations(), r)));
    // An aggrieved customer often tells it twice over; letters and odd cases say it once.
    if (category.equals("complaint") && r.nextInt(100) < 35) {
      String more = s.fill(DemoPeople.pick(c.situations(), r));
      if (!ask.contains(more)) {
        ask.add(more);
      }
    }
    if (r.nextInt(100) < 80) {
      ask.add(s.fill(DemoPeople.pick(c.asks(), r)));
    }
    String question = String.join(r.nextInt(3) == 0 ? "\n\n" : " ", ask);

    List<String> reply = new ArrayList<>();
    List<String> openers = switch (category) {
      case "complaint" -> COMPLAINT_OPENERS;
      case "legal" -> LEGAL_OPENERS;
      default -> List.of();
    };
    if (!openers.isEmpty() && r.nextInt(100) < 70) {
      reply.add(s.fill(DemoPeople.pick(openers, r)));
    }
    String middle = s.fill(DemoPeople.pick(c.acks(), r)) + " " + s.fill(DemoPeople.pick(c.findings(), r));
    if (r.nextInt(100) < 35) {
      String second = s.fill(DemoPeople.pick(c.findings(), r));
      if (!middle.contains(second)) {
        middle += " " + second;
      }
    }
    List<String> personal = switch (category) {
      case "complaint" -> COMPLAINT_PERSONAL;
      case "legal" -> LEGAL_PERSONAL;
      default -> OTHER_PERSONAL;
    };
    if (r.nextInt(100) < 55) {
      middle += " " + s.fill(DemoPeople.pick(personal, r));
    }
    reply.add(middle);
    String action = s.fill(DemoPeople.pick(c.actions(), r));
    if (r.nextInt(100) < 40) {
      String second = s.fill(DemoPeople.pick(c.actions(), r));
      if (!second.equals(action)) {
        action += " " + second;
      }
    }
    reply.add(action);
    List<String> closings = switch (category) {
      case "complaint" -> COMPLAINT_CLOSINGS;
      case "legal" -> LEGAL_CLOSINGS;
      default -> OTHER_CLOSINGS;
    };
    String closing = s.fill(DemoPeople.pick(closings, r));
    if (!closing.isEmpty()) {
      reply.add(closing);
    }
    String subject = s.fill(DemoPeople.pick(c.subjects(), r));
    String signature = switch (sender(c)) {
      case "solicitor" -> "Yours faithfully,\n{first} {last}\n" + (r.nextBoolean() ? "Associate" : "Solicitor") + ", {firm}";
      case "insurer" -> "Yours faithfully,\n{first} {last}\nRecoveries Team, {insurer}";
      default -> null;
    };
    boolean letter = category.equals("legal") || category.equals("complaint") && r.nextBoolean();
    return new OneOff(category, subject, question, String.join("\n\n", reply), letter, signature);
  }

  /** Who writes: most cases come from customers, a few only ever from a law firm or an insurer. */
  private static String sender(Case c) {
    if (c.topic().contains("your client") || c.topic().contains("conveyancing")) {
      return "solicitor";
    }
    return c.topic().contains("your insured") ? "insurer" : "customer";
  }

  /** The largest word overlap (Jaccard) of a reply with any of the others. */
  static double maxSimilarity(Set<String> words, List<Set<String>> others) {
    double max = 0;
    for (Set<String> o : others) {
      int common = 0;
      for (String w : words) {
        if (o.contains(w)) {
          common++;
        }
      }
      max = Math.max(max, common / (double) (words.size() + o.size() - common));
    }
    return max;
  }

  /** The words of a reply between its greeting and sign-off, lower-cased, without numbers. */
  static Set<String> replyWords(String reply) {
    String[] paras = reply.split("\n\n");
    Set<String> words = new HashSet<>();
    for (int i = 1; i < paras.length - 1; i++) {
      for (String w : paras[i].toLowerCase(Locale.ROOT).split("[^a-z]+")) {
        if (!w.isEmpty()) {
          words.add(w);
        }
      }
    }
    return words;
  }

  private static List<Case> build() {
    List<Case> all = new ArrayList<>();
    all.addAll(DemoOneOffComplaints.cases());
    all.addAll(DemoOneOffLegal.cases());
    all.addAll(DemoOneOffOther.cases());
    return List.copyOf(all);
  }
}
