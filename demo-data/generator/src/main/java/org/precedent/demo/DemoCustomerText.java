package org.precedent.demo;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Wraps a customer's core question in the things real messages carry: greetings, context, personal details,
 * sign-offs, quoted earlier mail, the odd pasted card number, and typos.
 *
 * <p>The aim is that the same question phrasing rarely produces the same message twice, and that cleaning and
 * retrieval are tested against the noise they will meet in a real help-desk export.
 */
final class DemoCustomerText {

  /** What the agent can see in the message: whether to greet by name and whether the account is known. */
  record Message(String body, boolean nameGiven, boolean accountGiven) {
  }

  private static final List<String> GREETINGS = List.of(
      "Hi,", "Hello,", "Hello there,", "Hi there", "Good morning,", "Good afternoon,", "Hiya", "Morning,",
      "Hi team,", "Dear TVWW,", "Hello TVWW");
  private static final List<String> FORMAL_GREETINGS = List.of(
      "Dear Sir/Madam,", "Dear Sir or Madam,", "To whom it may concern,", "Dear Customer Care team,");

  private static final List<String> CONTEXT = List.of(
      "I've been a customer for {years} years.",
      "I tried your website first but couldn't find an answer.",
      "I rang on {dayMonth} but was on hold for 40 minutes so I'm emailing instead.",
      "Sorry if this is the wrong address for this.",
      "I'm writing on behalf of my mum, who doesn't use email.",
      "We live at {house} {street}, {town}.",
      "I work shifts so email is easier for me than phoning.",
      "I did try calling but the lines were busy.",
      "I was told on the phone (ref {ref}) that someone would email me.",
      "I've just got back from a week away.",
      "My neighbour at number {house} said I should email you.",
      "Sorry to bother you.",
      "I'm not great with computers so please bear with me.",
      "It's a rented house and the letting agent told me to contact you direct.",
      "Quick question.",
      "Hope you're well.",
      "I've looked on the website but I'm still not sure.",
      "I'm a bit confused.",
      "We're a household of {n} if that matters.",
      "I've checked the letter you sent on {date} and it doesn't say.");

  private static final List<String> CLOSERS = List.of(
      "Thanks in advance.", "Please let me know asap.", "Look forward to hearing from you.",
      "Any help would be appreciated.", "Hope you can help.", "Can someone get back to me please?",
      "Thanks for your help.", "I'd appreciate a quick reply.", "Please don't just send me a link to the website.",
      "Many thanks for your time.", "Waiting to hear back.");
  private static final List<String> LETTER_CLOSERS = List.of(
      "I look forward to hearing from you.", "I look forward to your prompt response.",
      "I would be grateful for a reply in writing.", "Thank you for your attention to this matter.");

  private static final List<String> SIGN_OFFS = List.of(
      "Thanks, {first}", "Thanks\n{first}", "Cheers\n{first}", "{first}", "Many thanks\n{first}",
      "Thank you,\n{first} {last}", "Ta, {first}", "Best,\n{first}", "- {first}", "Thanks\n{first} {last}",
      "Kind regards\n{first}");
  private static final List<String> FORMAL_SIGN_OFFS = List.of(
      "Regards\n{first} {last}", "Kind regards,\n{first} {last}", "Yours faithfully,\n{first} {last}",
      "Yours sincerely\n{first} {last}", "Best regards,\n{first} {last}\n{house} {street}\n{town} {postcode}",
      "Kind regards\n\n{first} {last}\nMobile: {phone}", "Regards,\n{first} {last}\n{email}");

  private static final List<String> ACCOUNT_LINES = List.of(
      "My account number is {account}.", "Account: {account}", "Account no. {account}", "(account {account})",
      "my acc number is {account}", "Account ref {account}", "It's account {account} if that helps.",
      "The account number on the bill is {account}.");
  private static final List<String> PHONE_LINES = List.of(
      "You can reach me on {phone}.", "My number is {phone} if it's easier to call.", "Tel: {phone}",
      "Please call me on {phone} after 5pm.", "Mobile {phone}");
  private static final List<String> EMAIL_LINES = List.of(
      "My email is {email}.", "Please reply to {email} rather than this address.", "or email me at {email}");
  private static final List<String> ADDRESS_LINES = List.of(
      "The address is {house} {street}, {town} {postcode}.", "Address: {house} {street}, {postcode}",
      "Property: {house} {street}, {town}");

  /** Card and bank numbers customers sometimes paste; well-known test values, never real ones. */
  private static final List<String> PAYMENT_SLIPS = List.of(
      "I tried to pay online with my card 4111 1111 1111 1111 but it keeps getting declined.",
      "Here are my card details so you can take the payment: 4111 1111 1111 1111, expiry 09/28.",
      "If you need to refund me, my bank details are IBAN GB82 WEST 1234 5698 7654 32.",
      "Please take the money from GB82 WEST 1234 5698 7654 32.",
      "Card number 4111111111111111 if you need it.");

  private static final List<String> SENT_FROM = List.of(
      "Sent from my phone", "Sent from my mobile", "Sent from my tablet", "Sent from my phone, please excuse typos");

  private static final Pattern WORD = Pattern.compile("(?<![\\w@./-])[A-Za-z]{4,}(?![\\w@/-])");

  private DemoCustomerText() {
  }

  /** Dresses the core question as a whole message in one of several shapes, from one line to several paragraphs. */
  static Message compose(String core, DemoSlots s, Random r) {
    int shape = r.nextInt(100);
    boolean sloppy = r.nextInt(100) < 30;
    String text = sloppy ? typos(core, r, 1 + r.nextInt(2)) : core;
    if (shape < 22) {
      return shortMessage(text, s, r);
    }
    boolean longShape = shape >= 78;
    boolean formal = r.nextInt(100) < 18;
    List<String> paras = new ArrayList<>();
    if (r.nextInt(100) < (longShape ? 95 : 82)) {
      paras.add(DemoPeople.pick(formal ? FORMAL_GREETINGS : GREETINGS, r));
    }
    String first = text;
    if (r.nextInt(100) < (longShape ? 85 : 40)) {
      first = context(s, r, sloppy) + (r.nextInt(3) == 0 ? "\n" : " ") + text;
    }
    paras.add(first);
    if (longShape) {
      String more = context(s, r, sloppy);
      if (r.nextBoolean()) {
        more += " " + context(s, r, sloppy);
      }
      paras.add(more);
    }
    boolean accountGiven = false;
    List<String> details = new ArrayList<>();
    if (r.nextInt(100) < (longShape ? 70 : 50)) {
      details.add(s.fill(DemoPeople.pick(ACCOUNT_LINES, r)));
      accountGiven = true;
    }
    if (r.nextInt(100) < (longShape ? 35 : 18)) {
      details.add(s.fill(DemoPeople.pick(PHONE_LINES, r)));
    }
    if (r.nextInt(100) < 10) {
      details.add(s.fill(DemoPeople.pick(EMAIL_LINES, r)));
    }
    if (r.nextInt(100) < (longShape ? 30 : 12)) {
      details.add(s.fill(DemoPeople.pick(ADDRESS_LINES, r)));
    }
    if (!details.isEmpty()) {
      paras.add(String.join(r.nextBoolean() ? "\n" : " ", details));
    }
    if (r.nextInt(1000) < 18) {
      paras.add(DemoPeople.pick(PAYMENT_SLIPS, r));
    }
    if (r.nextInt(100) < (longShape ? 65 : 40)) {
      paras.add(longShape && r.nextInt(8) == 0 ? "Apologies for the long email." : DemoPeople.pick(CLOSERS, r));
    }
    boolean nameGiven = false;
    if (r.nextInt(100) < (longShape ? 92 : 78)) {
      paras.add(s.fill(DemoPeople.pick(formal ? FORMAL_SIGN_OFFS : SIGN_OFFS, r)));
      nameGiven = true;
    } else if (r.nextInt(100) < 30) {
      paras.add(1 < paras.size() ? 1 : 0, s.fill("My name is {first} {last}."));
      nameGiven = true;
    }
    if (r.nextInt(100) < 8) {
      paras.add(DemoPeople.pick(SENT_FROM, r));
    }
    String body = String.join("\n\n", paras);
    if (r.nextInt(100) < 10) {
      body = quoted(body, core, s, r);
    }
    return new Message(body, nameGiven, accountGiven);
  }

  /**
   * A formal letter: complaints written with care, and letters from solicitors and insurers, who sign with their
   * firm rather than a first name.
   *
   * @param signature the sender's signature block, or null for a private person's formal sign-off
   */
  static Message composeLetter(String core, String signature, DemoSlots s, Random r) {
    List<String> paras = new ArrayList<>();
    paras.add(r.nextInt(100) < 85 ? DemoPeople.pick(FORMAL_GREETINGS, r) : "Dear TVWW,");
    paras.add(r.nextInt(100) < 10 ? typos(core, r, 1) : core);
    boolean accountGiven = r.nextInt(100) < 45;
    if (accountGiven) {
      paras.add(s.fill(r.nextBoolean() ? "Account number: {account}" : "The account number is {account}."));
    }
    if (r.nextInt(100) < 70) {
      paras.add(DemoPeople.pick(LETTER_CLOSERS, r));
    }
    paras.add(signature != null ? s.fill(signature) : s.fill(DemoPeople.pick(FORMAL_SIGN_OFFS, r)));
    String body = String.join("\n\n", paras);
    if (r.nextInt(100) < 8) {
      body = quoted(body, core, s, r);
    }
    return new Message(body, true, accountGiven);
  }

  private static Message shortMessage(String text, DemoSlots s, Random r) {
    String body = text;
    if (r.nextInt(100) < 25) {
      body = body.toLowerCase(Locale.ROOT);
    }
    if (r.nextInt(100) < 20 && (body.endsWith(".") || body.endsWith("?"))) {
      body = body.substring(0, body.length() - 1);
    }
    boolean accountGiven = false;
    if (r.nextInt(100) < 35) {
      body += (r.nextBoolean() ? " " : "\n") + s.fill(r.nextBoolean() ? "acc {account}" : "{account}");
      accountGiven = true;
    }
    boolean nameGiven = false;
    if (r.nextInt(100) < 30) {
      body += "\n" + s.fill(r.nextBoolean() ? "{first}" : "Thanks {first}");
      nameGiven = true;
    }
    if (r.nextInt(100) < 12) {
      body += "\n\n" + DemoPeople.pick(SENT_FROM, r);
    }
    return new Message(body, nameGiven, accountGiven);
  }

  private static String context(DemoSlots s, Random r, boolean sloppy) {
    String line = s.fill(DemoPeople.pick(CONTEXT, r));
    return sloppy && r.nextInt(3) == 0 ? typos(line, r, 1) : line;
  }

  /** Appends the earlier mail the customer is replying to, as mail programs quote it. */
  private static String quoted(String body, String core, DemoSlots s, Random r) {
    String when = DemoSlots.mailDate(s.opened.minusDays(2 + r.nextInt(12)));
    return switch (r.nextInt(3)) {
      case 0 -> body + "\n\nOn " + when + ", TVWW Customer Care wrote:\n"
          + "> Thank you for contacting Tarnwick Vale Water & Waste.\n"
          + "> We've logged your enquiry under reference " + s.get("ref") + " and aim to reply within 5 working days.\n"
          + "> Please don't reply to this automated message.";
      case 1 -> body + "\n\nOn " + when + ", TVWW Customer Care <care@tarnwickvale.example> wrote:\n"
          + "> Hi " + s.first + ",\n>\n"
          + "> Thanks for your email. So that we can look into this, could you reply with your account number\n"
          + "> and the address of the property?\n>\n"
          + "> Kind regards,\n> " + DemoPeople.pick(DemoPeople.AGENTS, r) + "\n> TVWW Customer Care";
      default -> "I sent this on " + when + " and haven't had a reply.\n\n" + body + "\n\nOn " + when + ", "
          + s.first + " " + s.last + " <" + s.email + "> wrote:\n> " + core.replace("\n", "\n> ");
    };
  }

  /** Deterministic slips of the keyboard: a swapped, dropped or doubled letter in words of four letters or more. */
  static String typos(String text, Random r, int count) {
    List<int[]> words = new ArrayList<>();
    Matcher m = WORD.matcher(text);
    while (m.find()) {
      words.add(new int[] {m.start(), m.end()});
    }
    if (words.isEmpty()) {
      return text;
    }
    StringBuilder out = new StringBuilder(text);
    // Edits run from the end so earlier offsets stay valid.
    List<Integer> chosen = new ArrayList<>();
    for (int i = 0; i < count; i++) {
      int w = r.nextInt(words.size());
      if (!chosen.contains(w)) {
        chosen.add(w);
      }
    }
    chosen.sort((a, b) -> Integer.compare(b, a));
    for (int w : chosen) {
      int start = words.get(w)[0];
      int len = words.get(w)[1] - start;
      int at = start + 1 + r.nextInt(len - 2);
      switch (r.nextInt(3)) {
        case 0 -> {
          char c = out.charAt(at);
          out.setCharAt(at, out.charAt(at + 1));
          out.setCharAt(at + 1, c);
        }
        case 1 -> out.deleteCharAt(at);
        default -> out.insert(at, out.charAt(at));
      }
    }
    return out.toString();
  }
}
