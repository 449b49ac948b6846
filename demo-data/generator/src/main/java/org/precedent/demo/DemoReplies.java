package org.precedent.demo;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;

/**
 * Writes an agent's reply around an answer text the way agents do: a greeting by name when they have one, the
 * reused answer with small edits, an occasional note of the account number or date, and the agent's own sign-off.
 *
 * <p>Agents keep habits (each mostly greets and signs in one way), which is what a real team's export looks like
 * and what answer grouping has to see past.
 */
final class DemoReplies {

  /** The register a reply is written in. */
  enum Voice { ROUTINE, SAFETY, COMPLAINT, LEGAL, OTHER }

  private static final List<String> AGENT_SURNAMES = List.of(
      "Whitby", "Carrick", "Menon", "Lloyd-Pryce", "Novak", "Tranter", "Ofori", "Qureshi", "Tregear", "Munro",
      "Bakare", "Sorensen", "Daly", "Loxley");

  private static final List<String> NAMED_GREETINGS = List.of("Hi {first},", "Hello {first},", "Dear {first} {last},",
      "Good morning {first},", "Hi {first}");
  private static final List<String> ANON_GREETINGS = List.of("Hello,", "Hi there,", "Dear customer,", "Good afternoon,");

  private static final List<String> OPENERS = List.of(
      "Thanks for getting in touch.", "Thank you for your email.", "Sorry for the trouble.", "Thanks for letting us know.",
      "Thanks for your message.", "Sorry for the delay in getting back to you.",
      "Thanks for your patience while we looked into this.");
  private static final List<String> COURTESY = List.of(
      "I hope this helps.", "Let us know if there's anything else we can do.", "Any problems, just reply to this email.",
      "Have a good day.", "Sorry again for the inconvenience.", "Thanks for your patience.");

  private static final List<String> SIGN_OFFS = List.of(
      "Kind regards,\n{agent}\nTVWW Customer Care",
      "Best wishes,\n{agent}\nCustomer Care, Tarnwick Vale Water & Waste",
      "Many thanks,\n{agent}\nTVWW Customer Care Team",
      "Regards,\n{agent} | Customer Care\nTarnwick Vale Water & Waste",
      "Thanks,\n{agent}\nTVWW Customer Care");

  /** Word changes agents make when they paste an answer, each keeping its meaning. */
  private static final String[][] REWORDINGS = {
      {"within 2 ", "in 2 "}, {"within 5 ", "in 5 "}, {"within 10 ", "in 10 "}, {"usually", "normally"},
      {"straight away", "right away"}, {"We'll", "We will"}, {"we'll", "we will"}, {"you'll", "you will"},
      {"don't", "do not"}, {"can't", "cannot"}, {"about two", "around two"}, {"free of charge", "at no cost"},
      {"just let us know", "just tell us"}, {"If you're", "If you are"}, {"There's", "There is"},
      {"Sorry", "I'm sorry"}};

  private DemoReplies() {
  }

  static String reply(String text, DemoSlots s, DemoCustomerText.Message m, Voice voice, Random r) {
    int agent = r.nextInt(DemoPeople.AGENTS.size());
    String agentName = DemoPeople.AGENTS.get(agent);
    boolean habit = r.nextInt(100) < 75;
    List<String> paras = new ArrayList<>();
    paras.add(greeting(s, m, voice, habit ? agent : r.nextInt(16)));

    String answer = voice == Voice.ROUTINE || voice == Voice.SAFETY ? edit(text, r) : text;
    int openerChance = switch (voice) {
      case ROUTINE -> 40;
      case SAFETY -> 15;
      default -> 0;
    };
    // An answer that already opens with thanks or an apology needs no second one in front of it.
    boolean opensItself = answer.startsWith("Thank") || answer.startsWith("Sorry") || answer.startsWith("We're very sorry")
        || answer.startsWith("Welcome");
    if (!opensItself && r.nextInt(100) < openerChance) {
      String opener = DemoPeople.pick(OPENERS, r);
      if (r.nextBoolean()) {
        paras.add(opener);
      } else {
        answer = opener + " " + answer;
      }
    }
    paras.add(answer);

    List<String> extras = new ArrayList<>();
    boolean pasted = voice == Voice.ROUTINE || voice == Voice.SAFETY;
    if (pasted && m.accountGiven() && r.nextInt(100) < 18) {
      extras.add(r.nextBoolean()
          ? "I've added a note to account " + s.accountCanonical + " so anyone you speak to can see this."
          : "For reference, I checked this against account " + s.accountCanonical + ".");
    }
    if (pasted && r.nextInt(100) < 10) {
      String today = r.nextBoolean() ? DemoSlots.numericDate(s.opened.plusDays(r.nextInt(3)))
          : DemoSlots.dayMonth(s.opened.plusDays(r.nextInt(3)), r);
      extras.add("I've logged this contact on your account today, " + today + ".");
    }
    if (voice == Voice.ROUTINE && r.nextInt(100) < 40) {
      extras.add(DemoPeople.pick(COURTESY, r));
    }
    if (!extras.isEmpty()) {
      paras.add(String.join(" ", extras));
    }
    paras.add(signOff(agent, agentName, voice, habit ? agent : r.nextInt(16)));
    return String.join("\n\n", paras);
  }

  private static String greeting(DemoSlots s, DemoCustomerText.Message m, Voice voice, int style) {
    if (voice == Voice.COMPLAINT || voice == Voice.LEGAL) {
      return s.fill("Dear {first} {last},");
    }
    if (!m.nameGiven()) {
      return ANON_GREETINGS.get(style % ANON_GREETINGS.size());
    }
    return s.fill(NAMED_GREETINGS.get(style % NAMED_GREETINGS.size()));
  }

  private static String signOff(int agent, String agentName, Voice voice, int style) {
    String full = agentName + " " + AGENT_SURNAMES.get(agent);
    return switch (voice) {
      case COMPLAINT -> "Yours sincerely,\n" + full + "\nCustomer Relations Team\nTarnwick Vale Water & Waste";
      case LEGAL -> "Yours sincerely,\n" + full + "\nLegal and Insurance Team\nTarnwick Vale Water & Waste";
      default -> SIGN_OFFS.get(style % SIGN_OFFS.size()).replace("{agent}", agentName);
    };
  }

  /**
   * The small edits of a pasted answer: now and then a sentence left out or a word changed, and sometimes a
   * paragraph break. The answer keeps its meaning, so it still belongs to the same group.
   */
  static String edit(String answer, Random r) {
    List<String> sentences = new ArrayList<>(List.of(answer.split("(?<=[.!?])\\s+(?=[A-Z])")));
    if (sentences.size() >= 4 && r.nextInt(100) < 18) {
      sentences.remove(1 + r.nextInt(sentences.size() - 1));
    }
    if (r.nextInt(100) < 22) {
      List<String[]> present = new ArrayList<>();
      for (String[] pair : REWORDINGS) {
        if (String.join(" ", sentences).contains(pair[0])) {
          present.add(pair);
        }
      }
      if (!present.isEmpty()) {
        String[] pair = present.get(r.nextInt(present.size()));
        for (int i = 0; i < sentences.size(); i++) {
          if (sentences.get(i).contains(pair[0])) {
            sentences.set(i, sentences.get(i).replaceFirst(java.util.regex.Pattern.quote(pair[0]), pair[1]));
            break;
          }
        }
      }
    }
    if (sentences.size() >= 4 && r.nextInt(100) < 15) {
      int cut = 2 + r.nextInt(sentences.size() - 3);
      return String.join(" ", sentences.subList(0, cut)) + "\n\n"
          + String.join(" ", sentences.subList(cut, sentences.size()));
    }
    return String.join(" ", sentences);
  }
}
