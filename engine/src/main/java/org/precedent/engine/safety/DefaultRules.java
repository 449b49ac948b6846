package org.precedent.engine.safety;

import java.util.List;
import java.util.Set;
import org.precedent.engine.safety.SafetyRule.Specificity;

/**
 * The built-in term rules: a general part for any help desk, and trade packs a policy file chooses from.
 *
 * <p>Patterns are written for questions as {@link SafetyPolicy} prepares them: one space between words, straight
 * apostrophes, matched case-insensitively, and only where the match starts and ends at a word edge. They name the
 * situation, not a lone word, because single words are shared with routine questions: "brown" is also the garden
 * waste bin, "court" is also a street name, "sewerage" is also a line on the bill, "leak" is also a dripping cistern,
 * "stolen" is also a wheelie bin, "frozen" is also a pipe in winter, "dispute" is also a meter reading. A rule may
 * fire on a routine question now and then; a missed emergency costs far more than a needless hand-off.
 *
 * <p>{@link #ALL} is in the order that breaks ties between rules of the same specificity: the more urgent risk
 * first. Danger to life (a customer in distress, an emergency, gas, electricity) comes before danger to health (the
 * packs' illness, sewage, burst mains, water quality), which comes before money (account security, lost or stolen
 * means of payment, fraud, disputes) and legal matters. Choosing packs leaves some rules out; it never reorders.
 *
 * <p>The general rules were written from the support trade's own vocabulary and from the train split of CLINC150
 * (Larson et al. 2019); its test split is kept for measuring them ({@code ClincHandOffTest}).
 *
 * <p>Runs of filler words ("is very really ...") take at most eight words and are possessive ({@code {0,8}+}), so that
 * a hostile question costs time linear in its length and a constant stack. Unbounded, a run that holds the rule's own
 * first word ("tastes and tastes and tastes ...") is read again from each of its starts, quadratic in its length; and
 * java.util.regex recurses once per repetition of a group it may have to give back, so thousands of fillers overflow
 * the stack, while a possessive repetition is a loop that is never re-split. No filler is a word that can follow its
 * run, so a possessive run finds everything a greedy one would; "all over" after sewage, whose "all" is also a filler,
 * is written as "(all )?over" for that reason.
 */
final class DefaultRules {

  /** The pack every help desk gets with the built-in rules. */
  static final String GENERAL = "general";
  /** Water supply, sewers and waste collection: the demo utility's trade. */
  static final String WATER_WASTE = "water-waste";
  /** Gas and electricity supply. */
  static final String ENERGY = "energy";
  /** The packs a policy file may choose; {@link #GENERAL} is not among them because it is always in. */
  static final Set<String> TRADE_PACKS = Set.of(WATER_WASTE, ENERGY);

  /** One rule before compiling: its id, topic, pack, specificity and pattern source. */
  record Spec(String id, String topic, String pack, Specificity specificity, String regex) {
  }

  private static final Specificity SITUATION = Specificity.SITUATION;
  private static final Specificity SIGN = Specificity.SIGN;

  /** A few words of the same clause: punctuation stops the gap, so matches stay within one thought. */
  private static String gap(int words) {
    return "(?:[\\w'&]+ ){0," + words + "}";
  }

  /**
   * A few words that describe the noun after them ("my <i>capital one credit</i> card"): like {@link #gap}, but no
   * preposition or verb, so "the expiry date on my card" does not read as "the ... card".
   */
  private static String modifiers(int words) {
    return "(?:(?!(?:on|of|for|in|with|to|from|at|and|or|is|was|are|were|i|it|that|which)\\b)[\\w'&-]+ ){0,"
        + words + "}";
  }

  private static final String COLOUR = "(?:brown|orange|yellow|rusty|muddy|black)(?:ish)?";
  private static final String WATER_VERB = "(?:is|was|are|looks?|looked|looking|has gone|had gone|has been|is going|"
      + "went|gone|turned|turning|coming out|comes out|came out|running|runs|ran)";
  private static final String DEGREE =
      "(?:(?:all|very|really|quite|a bit|a|slightly|light|dark|pale|deep|bright|completely) ){0,8}+";
  private static final String SEWAGE = "(?:(?:raw|untreated) )?(?:sew(?:er)?age|foul water)";
  private static final String ROOM = "(?:(?:my|the|our|their|back|front|rear|downstairs|upstairs) ){0,8}+(?:house|home|"
      + "garden|kitchen|cellar|basement|bathroom|yard|street|road|drive|driveway|toilet|bath|shower|sink|property|"
      + "hall|hallway|living room|lounge|flat|patio|lawn)";
  private static final String PUBLIC_WAY = "(?:road|roads|street|pavement|footpath|tarmac|junction|carriageway)";
  private static final String UNWELL = "(?:(?:is|was|are|were|been|be|feel|feels|felt|feeling|fell|falling|got|"
      + "getting|became|become|gone|went|made|making|makes?|very|quite|really) ill|sick(?! of| and tired)|unwell|"
      + "vomit\\w*|being sick|throwing up|diarrh?o?ea|diarrhoea|upset stomachs?|stomach (?:upsets?|bugs?|aches?|"
      + "pains?|cramps?)|tummy (?:bugs?|aches?|pains?|upsets?)|food poisoning|rash(?:es)?|poisoned)";


  // The general part.
  private static final String OWNER = "(?:my|our|his|her|their|the|a|an|this|that|one of my|both my|all my)";
  private static final String PAYMENT_MEANS = "(?:cards?|visa|mastercard|master card|amex|american express|wallet|"
      + "purse|cheque ?book|check ?book|chequebook|checkbook|cheques|checks|bank card|card details|bank details)";
  private static final String LOST = "(?:lost|misplaced|mislaid|stolen|stole|nicked|pinched|swiped|"
      + "(?:can't|cannot|can not|couldn't|could not|unable to) (?:seem to )?(?:find|locate))";
  private static final String ACCOUNT = "(?:account|accounts|card|cards|visa|mastercard|amex|banking|online banking|"
      + "checking|savings|market)";
  private static final String MONEY_ITEM = "(?:charges?|transactions?|purchases?|payments?|debits?|withdrawals?|"
      + "transfers?|activity|activities|entries|entry|amounts?)";
  private static final String PERSON = "(?:i|i'm|im|we|we're|he|she|they|someone|somebody|my (?:son|daughter|child|"
      + "kids?|children|husband|wife|partner|mum|mother|mom|dad|father|neighbou?r|friend|baby|nan|gran|grandma|"
      + "grandad|grandfather|grandmother|colleague|brother|sister|dog|cat)|a (?:child|man|woman|person|pedestrian|"
      + "cyclist|driver|passer-?by|worker|neighbou?r))";

  private static final List<Spec> GENERAL_DANGER = List.of(
      // A customer in distress: self-harm language goes to a person with a caution pointing to emergency help.
      new Spec("distress-self-harm", "distress", GENERAL, SITUATION, "suicid\\w*|kill(?:ing)? myself|"
          + "(?:end|ending|ended|take|taking) (?:my|my own) life|end(?:ing)? it all|"
          + "(?:want|wanted|wanting|going|gonna|planning|plan|thinking about|thought about|tempted|ready) (?:to )?"
          + "(?:die|hurt myself|harm myself|hurting myself|harming myself|end it|kill myself|not be here anymore|"
          + "not be here any more)|"
          + "wish (?:i|i'd) (?:was|were|had been|'d been|could be) (?:dead|never born)|better off dead|"
          + "(?:everyone|everybody|they|you|my family|my kids) (?:would be|'d be|are|is) better off without me|"
          + "(?:no|nothing|not much|not any) (?:reason|point) (?:to|in) (?:live|living|go on|going on|carry on|"
          + "carrying on|be alive|being alive)|"
          + "(?:don't|do not|dont) want to (?:live|be alive|wake up|go on|exist)(?! (?:in|at|with|near|there|here|on|"
          + "like that|without))|"
          + "self[- ]?harm\\w*|overdos\\w*|can't go on (?:living|any ?more)|cannot go on (?:living|any ?more)"),
      // Danger to life or health anywhere: fire, injury, a medical emergency, abuse.
      new Spec("emergency-danger", "emergency", GENERAL, SITUATION, "(?:is|was|are|were|it's|it is) on fire|"
          + "caught fire|catching fire|catch fire|set (?:itself )?on fire|(?:house|kitchen|electrical|chimney) fire|"
          + "flames (?:coming|shooting|from)|smoke (?:is )?(?:coming|pouring|billowing) (?:from|out)|full of smoke|"
          + PERSON + " (?:(?:'m|am|is|was|were|'s|has|have|had|got|'ve|been|just|badly|seriously|really|"
          + "has been|have been) ){0,8}+(?:hurt|injured|wounded|burned|burnt|scalded|electrocuted|knocked (?:down|over|"
          + "out)|hit by)(?! (?:my|your|our|the) (?:credit|feelings))|"
          + "(?:broke|broken|fractured|hurt|cut|injured|twisted|sprained) (?:my|his|her|their) (?:arm|leg|ankle|"
          + "wrist|hip|foot|hand|nose|back|neck|head|knee|shoulder|elbow|finger|toe|ribs?)|"
          + "(?:can't|cannot|can not|couldn't|struggling to|hard to) breathe|(?:trouble|difficulty) breathing|"
          + "not breathing|stopped breathing|chest pains?|heart attack|(?:having|had|has had) a (?:stroke|seizure|"
          + "fit)|unconscious|unresponsive|passed out|" + PERSON + " (?:has |had |just )?collapsed|"
          + "anaphyla\\w*|allergic reaction|(?:called|call|calling|phoned|need|needed|waiting for) "
          + "(?:an |for an |the )?"
          + "ambulance|ambulance (?:came|was called|is coming|took)|(?:taken|rushed|admitted) to (?:hospital|a&e)|"
          + "danger to life|life[- ]threatening|risk to life|(?:someone|somebody|a child|a kid) (?:will|could|is going "
          + "to|might) (?:be killed|die|get killed|get hurt|be hurt)|"
          + "domestic (?:abuse|violence)|abusive (?:partner|husband|wife|ex|relationship|boyfriend|girlfriend)|"
          + "(?:afraid|scared|fear|frightened|fearing) for (?:my|our|his|her|their) (?:life|lives|safety)|"
          + "threaten(?:ed|ing|s)? to (?:kill|hurt|harm|stab|attack) (?:me|us|my)"),
      new Spec("emergency-burning-smell", "emergency", GENERAL, SIGN, "(?:smells?|smelling|smelt|smelled) "
          + "(?:of )?burning|burning smell|smell of burning|(?:smoke|smoking) (?:alarm|detector) (?:is |keeps )?"
          + "(?:going off|went off|beeping)"),
      // Gas and electricity: no answer from a help desk should come before leaving the building.
      new Spec("gas", "gas", GENERAL, SITUATION, "gas (?:leak\\w*|smell|escape)s?|(?:smell|smells|smelling|smelt|"
          + "smelled|whiff) (?:of )?gas|carbon monoxide|co (?:alarm|detector)"),
      new Spec("electricity", "electricity", GENERAL, SITUATION, "electric(?:al|ity)? shocks?|"
          + "(?:got|get|getting|had|gave me|giving me) an? (?:electric(?:al)? )?shock (?:from|off)|"
          + "sparking|sparks (?:coming|flying|from)|"
          + "(?:exposed|bare|live|damaged) (?:electric(?:al)? )?(?:wires?|wiring|cables?)|"
          + "water " + gap(3) + "(?:fuse ?box|consumer unit|electrics|sockets?|light fittings?)|"
          + "(?:fuse ?box|consumer unit|electrics|sockets?) " + gap(2) + "(?:wet|soaked|under water|flooded)"));

  // The energy pack: overhead lines, and households that must not be left without power or heat.
  private static final String MEDICAL_KIT = "(?:oxygen(?: concentrator| machine| supply)?|dialysis(?: machine)?|"
      + "ventilator|life[- ]support|feeding pump|medical equipment|medical devices?|cpap(?: machine)?|"
      + "suction machine|heart monitor|electric wheelchair|stair ?lift|hoist)";
  private static final String NO_POWER = "(?:power cut|power outage|outage|blackout|no power|without power|"
      + "lost power|loss of power|power (?:is |has |went |has gone |keeps going )?(?:off|out|down)|no electric(?:ity)?|"
      + "without electric(?:ity)?|electric(?:ity)? (?:is |has |went |has gone )?(?:off|out)|no gas|without gas|"
      + "cut off|disconnect(?:ed|ing|ion)?)";
  private static final String AT_RISK = "(?:baby|babies|newborn|toddler|elderly|disabled|pregnant|frail|"
      + "vulnerable|(?:very |seriously |terminally )?ill|chemo\\w*|cancer|oxygen|hypothermia|dementia|"
      + "(?:[\\w']+ )?(?:in|over) (?:her|his|their) (?:80s|90s|eighties|nineties))";
  private static final String NO_HEAT = "(?:no|without|lost|run out of|ran out of|running out of) (?:(?:any|our|my|"
      + "the) )?(?:heating|heat|gas|electric|electricity|power)";

  private static final List<Spec> ENERGY_DANGER = List.of(
      new Spec("energy-line-down", "electricity", ENERGY, SITUATION, "(?:power|electricity|electric|overhead|"
          + "pylon) (?:lines?|cables?|wires?) (?:(?:is|are|has|have|had|been|just|now) ){0,8}+(?:down|fallen|come down|"
          + "came down|snapped|hanging down|dangling|on the (?:ground|road|floor|pavement))|"
          + "(?:fallen|snapped|dangling|low-hanging|low hanging) (?:power |electricity |electric |overhead )"
          + "(?:lines?|cables?|wires?)|"
          + "(?:pylon|electricity pole|power pole|telegraph pole) (?:(?:is|has|was|have) ){0,8}+(?:down|fallen|come down|"
          + "leaning|on fire|collapsed)|substation (?:is )?(?:on fire|fire|explo\\w*|sparking|open|broken into)"),
      new Spec("energy-medical-dependency", "vulnerable-supply", ENERGY, SITUATION, MEDICAL_KIT + " " + gap(10)
          + NO_POWER + "|" + NO_POWER + " " + gap(10) + MEDICAL_KIT),
      new Spec("energy-vulnerable-no-heat", "vulnerable-supply", ENERGY, SITUATION, NO_HEAT + " " + gap(8)
          + AT_RISK + "|" + AT_RISK + " " + gap(8) + NO_HEAT + "|"
          + "(?:ran|run|running) out of (?:emergency |gas |electric |electricity )?credit|"
          + "(?:can't|cannot|can not|couldn't|could not) afford to (?:top up|heat|put (?:money|credit) on)|"
          + "self[- ]disconnect\\w*|"
          + "(?:cut off|disconnect|disconnected|disconnecting|switch off|switched off|turn off|turned off|"
          + "cutting off) (?:my|our|the) (?:gas|electricity|electric|power|energy)(?! (?:at|valve|tap|switch|"
          + "before|while|when|for the))"));

  private static final List<Spec> GENERAL_MONEY_LEGAL = List.of(
      // Account compromise, and requests to block or freeze an account or card (what customers ask after one).
      new Spec("account-compromise", "account-security", GENERAL, SITUATION, "hacked|hackers?|hacking (?:into|my)|"
          + "(?:account|card|email|password|details|pin|login|log-?in|identity|data|information|phone|sim) "
          + "(?:(?:has|have|had|was|were|is|are|been|got|may|might|could|must|have|be|i think|probably) ){0,8}+"
          + "(?:compromised|breached|leaked|exposed|hijacked|taken over|cloned|skimmed|swapped)|"
          // A stolen card is lost-stolen; stolen credentials are a compromise of the account they open.
          + "(?:password|passwords|pin|passcode|login details|log-?in details|security details|personal details|"
          + "online banking details) (?:(?:has|have|had|was|were|is|are|been|got|may|might|could|must|be) ){0,8}+stolen|"
          + "(?:cloned|skimmed) cards?|data breach|sim swap\\w*|"
          + "(?:someone|somebody|a stranger|a thief|thieves|some(?:one|body) else|they) (?:(?:has|had|have|is|was|"
          + "were|must have|may have|might have|could have|else|just) ){0,8}+(?:accessed|access|got into|gotten into|"
          + "logged into|logging into|logged in to|broken into|broke into|taken over|took over|changed the "
          + "password (?:on|of|for)) (?:my|our) " + modifiers(3) + "(?:account|accounts|login|email|profile|"
          + "online banking|banking|app)|"
          + "(?:gave|given|shared|told|sent|handed over) (?:my|our|the) " + modifiers(2) + "(?:pin|password|"
          + "passcode|security code|one[- ]time (?:code|password|passcode)|otp|card details|bank details|card "
          + "number|login details|security details) to (?:a |an |some )?(?:scammer|fraudster|stranger|someone|"
          + "somebody|caller|man|woman|person|fake)"),
      new Spec("account-freeze-request", "account-security", GENERAL, SITUATION, "(?:freeze|freezing|froze|block|"
          + "blocking|halt|hault|suspend|disable|deactivate|lock|lock down|pause|hold) (?:(?:all|any|further|future|"
          + "immediately) ){0,8}+(?:my|our|the|this|that) " + gap(4) + ACCOUNT + "|"
          + "(?:put|place|placed|putting|placing|add|adding|do|get|need|want|like|a|an) (?:a |an )?(?:stop|block|"
          + "freeze|hold|halt|hault|lock|pause)(?: (?:put|placed|added))? (?:on|to) (?:my|our|the|this|that) "
          + gap(4) + ACCOUNT + "|(?:put|place) (?:my|our|the) " + gap(3) + "account on (?:hold|stop|ice)|"
          + "(?:stop|pause|hold) (?:all )?(?:my|our|the) " + modifiers(2) + "(?:account activity|account|banking)"
          + "(?! (?:number|details|name|holder|reference))|"
          + "(?:account|checking|savings) (?:placed |put )?under a (?:block|freeze|hold|stop)|"
          + "(?:a|an) (?:block|freeze|stop|hold|halt) (?:(?:placed|put|added) )?" + gap(3) + "on (?:my|our|the) "
          + gap(4) + ACCOUNT + "|"
          + "(?:stop|prevent|block) (?:anyone|anybody|people|others|someone|somebody|them|the thief|thieves) (?:else )?"
          + "(?:from )?(?:using|accessing|getting into|taking money from|spending) (?:my|our|the) " + modifiers(3)
          + ACCOUNT + "|(?:stop|prevent|block) (?:my|our|the) " + modifiers(3) + "(?:card|cards|account) (?:from )?"
          + "being used|(?:no one|nobody|no-one) (?:else )?(?:can|could|is able to) (?:use|access|get into|withdraw "
          + "from|spend from) (?:my|our|the) " + modifiers(3) + ACCOUNT + "|"
          + "(?:turn|switch|shut) off (?:my|our|the) " + modifiers(3) + "cards?|"
          + "(?:freeze|block|stop|halt|pause|suspend|disable) (?:all|any|every) " + gap(2)
          + "(?:activity|transactions?|payments?|"
          + "charges?) " + gap(4) + "(?:on|from|in|through|to) (?:my|our|the) " + gap(4) + ACCOUNT + "|"
          + "no (?:more |further )?(?:payments?|transactions?|withdrawals?) (?:on|from|out of|to) (?:my|our|the) "
          + modifiers(3) + "account|"
          + "(?:stop|halt|pause|block|prevent) (?:(?:all|any|further|future|more) ){0,8}+(?:payments?|transactions?|"
          + "activity|processing|withdrawals?|charges?|actions?) (?:on|to|from|in|through|using|with|going "
          + "through|out of) (?:my|our|the) " + modifiers(3) + "(?:account|bank|card)|"
          + "(?:don't|do not|dont) (?:let|allow) (?:any )?(?:more |further )?(?:payments?|transactions?|actions?|"
          + "activity|withdrawals?|charges?) " + gap(3) + "(?:my|our|the) " + modifiers(3) + "(?:account|card)|"
          + "(?:want|need|like|make sure|set|turn|have|get|make) (?:my|our|the) " + modifiers(3)
          + "(?:account|card) (?:to be |as |a |is |be |to |frozen )?(?:frozen|blocked)|"
          + "(?:account|card|checking|savings) (?:must|needs to|should|has to|can|could|to) be (?:frozen|blocked|"
          + "locked|suspended|stopped)|"
          + "(?:freeze|block) (?:it|them) (?:now|immediately|right away|straight away|asap|before)"),

      // Lost or stolen means of payment.
      new Spec("lost-stolen-payment", "lost-stolen", GENERAL, SITUATION, LOST + " " + OWNER + " "
          + modifiers(3) + PAYMENT_MEANS + "(?!'s)|"
          + PAYMENT_MEANS + " (?:(?:is|was|has|have|had|been|got|gets|get|'s|just|now|probably|possibly|maybe|"
          + "definitely|either|to be|needs to be|need to be|reported|report|marked|labeled|labelled|as|it|it's|"
          + "that|that's|which|being) ){0,8}+(?:lost|stolen|missing|nicked|misplaced|gone missing|disappeared|vanished|"
          + "taken(?! (?:by|in|into) (?:the |a |an )?(?:atm|machine|cash machine|cashpoint)))|"
          + PAYMENT_MEANS + ", (?:it's|it is|it was|it has|it's been|it has been|it got|they're|they were|they have) "
          + "(?:been )?(?:lost|stolen|gone missing)|"
          + "(?:lost|stolen|missing|misplaced) " + modifiers(3) + PAYMENT_MEANS + "|"
          + "(?:card|credit card|debit card|cheque|check|wallet|purse) (?:theft|thief|thieves)|"
          + "(?:left|dropped) " + OWNER + " " + modifiers(3) + PAYMENT_MEANS + " (?:in|at|on|behind|somewhere|"
          + "outside)|"
          + "(?:i was|i've been|i have been|i got|we were|we've been|we have been|we got|been) (?:mugged|robbed|"
          + "pickpocketed|pick-pocketed|burgled|burglarized)"),

      // Fraud: the situation named, then the signs of it.
      new Spec("fraud", "fraud", GENERAL, SITUATION,
          "fraud\\w*|fradulent|fraudlent|defraud\\w*|scam(?:s|med|mer|mers|ming)?|phish\\w*|smishing|"
          + "vishing|identity theft|(?:stolen|stole my) identity|identity (?:was |has been |had been )?stolen|"
          + "unauthori[sz]ed " + modifiers(2) + "(?:charges?|transactions?|payments?|purchases?|debits?|"
          + "withdrawals?|transfers?|use|usage|access|activity|logins?|log-?ins?)|"
          + "(?:illegal|false|fake|bogus) (?:charges?|transactions?|payments?|purchases?|debits?|withdrawals?)|"
          + MONEY_ITEM + " " + gap(6) + "(?:that |which )?(?:i|we) (?:didn't|did not|never|have not|haven't) "
          + "(?:make|made|authori[sz]e|authori[sz]ed|approve|approved|agree to|agreed to|sign up for|signed up for)|"
          + "(?:didn't|did not|never|haven't|have not|wasn't|was not) (?:make|made|authori[sz]e|authori[sz]ed|approve|"
          + "approved|agree to|agreed to|buy|bought|order|ordered|do|spend|request|requested) (?:any of )?(?:this|that|"
          + "these|those) " + modifiers(2) + MONEY_ITEM + "|"
          + "(?:things|items|stuff|something|goods|products|orders|services|subscriptions?) (?:that )?(?:i|we) "
          + "(?:didn't|did not|never) (?:buy|bought|order|ordered|purchase|purchased|make|made|sign up for|signed "
          + "up for)|theft (?:on|from|of) (?:my|our) " + modifiers(3) + "(?:account|card|money|funds)|"
          + "(?:used|using|use|took|taken|withdrew|withdrawn|spent|charged|debited|made) " + gap(5) + "without "
          + "(?:my|our) (?:permission|consent|authori[sz]ation|knowledge|approval)|"
          + "(?:used|charged|accessed|charging|using) by (?:someone|somebody|a stranger|a thief)|"
          + "(?:someone|somebody|a thief|thieves|a stranger|some(?:one|body) else) (?:(?:has|had|have|is|was|"
          + "must have|may have|might have|could have|else|just) ){0,8}+(?:used|using|use|spent|spending|took money|"
          + "charging|taken money|withdrawn|withdrew|made (?:charges|purchases|payments|transactions)|charged|bought|"
          + "misused|emptied) " + gap(3) + "(?:my|our|the|it|them)(?: " + modifiers(3) + "(?:cards?|account|"
          + "accounts|details|money|visa|mastercard|amex|bank))?"),
      new Spec("fraud-signs", "fraud", GENERAL, SIGN, "(?:suspicious|questionable|shady|strange|unusual|odd|"
          + "weird|unknown|unfamiliar|dodgy|unexpected|random) " + modifiers(2) + MONEY_ITEM + "|"
          + "(?:suspicious|unusual|strange) (?:log-?ins?|logins?|sign-?ins?|emails?|texts?|messages?|links?|calls?)|"
          + MONEY_ITEM + " " + gap(7) + "(?:i|we) (?:don't|do not|didn't|did not|can't|cannot) recogni[sz]e|"
          + "(?:don't|do not|didn't|did not|can't|cannot) recogni[sz]e (?:this|these|that|those|the|a|an|some|any|"
          + "one|two|several) " + modifiers(2) + MONEY_ITEM + "|"
          + "unrecogni[sz]ed " + modifiers(1) + MONEY_ITEM + "|"
          + MONEY_ITEM + " " + gap(6) + "(?:i|we) (?:don't|do not|can't|cannot|didn't) (?:remember|recall) "
          + "(?:making|authori[sz]ing|buying|ordering|doing|agreeing)|"
          + MONEY_ITEM + " " + gap(6) + "(?:i'm|i am|we're|we are|i was|we were) (?:not|un)? ?aware of|"
          + MONEY_ITEM + " " + gap(6) + "(?:i|we) (?:know nothing about|don't know anything about|have no idea about|"
          + "have no knowledge of|never heard of)|"
          + MONEY_ITEM + " " + gap(4) + "(?:that |which )?(?:don't|do not|doesn't|does not) belong to (?:me|us)|"
          + MONEY_ITEM + " " + gap(5) + "(?:that |which )?(?:isn't|aren't|wasn't|weren't|is not|are not|was not|"
          + "were not) (?:mine|made by me|by me|from me|ours)|not made by me|"
          + "(?:something|anything) (?:fishy|dodgy|suspicious|odd|strange|weird|wrong) (?:going on )?(?:on|in|with|"
          + "about) (?:my|our|the) " + modifiers(3) + "(?:card|account|statement|bank)|"
          + "money (?:has |have )?(?:gone|disappeared|vanished|missing|been taken|taken) (?:from|out of) (?:my|our) "
          + modifiers(3) + "(?:account|card|bank)"),

      // Money owed in dispute, disputed charges and refunds. Before legal, so that a county court judgment is
      // reported as a debt matter.
      new Spec("money-dispute", "money-dispute", GENERAL, SITUATION, "bailiffs?|enforcement (?:agents?|officers?)|"
          + "debt collectors?|debt collection agency|county court judge?ments?|ccjs?|compensation claim|"
          + "claim (?:for )?compensation|(?:claim|claiming|seek|seeking|demand|demanding|want|expect|entitled to) "
          + "(?:some |full |financial )?compensation|charge ?backs?"),
      new Spec("disputed-charge", "money-dispute", GENERAL, SITUATION, "disput\\w* (?:a|the|this|that|these|those|"
          + "my|an|some|one|two|several) " + modifiers(2) + "(?:charges?|transactions?|payments?|debits?|bills?|"
          + "invoices?|purchases?|refunds?|fees?|fines?|penalt(?:y|ies)|amounts?|debts?)|"
          + "disputed " + modifiers(2) + "(?:charges?|transactions?|payments?|debits?|purchases?|debts?|amounts?|"
          + "bills?|invoices?)|(?:billing|payment|charge|debt) disputes?|"
          + "(?:charges?|transactions?|payments?|debits?|purchases?) (?:that )?(?:i|we) (?:want|need|wish|would like|"
          + "'d like) to dispute|(?:want|need|wish|would like|'d like|like|going|have) to dispute (?:it|this|that|"
          + "them|these|those)|(?:raise|open|file|start|make|lodge|opened|filed|raised|made) (?:a )?dispute|"
          + "(?:charged|billed|debited|taken|deducted|charging|billing) (?:me |us )?(?:twice|double|two times|three "
          + "times|more than once)|double[- ]?(?:charged|billed|charge|charging|debited)|"
          + "duplicate (?:charges?|payments?|transactions?|debits?)|"
          + "(?:refuse|refused|refusing|refuses|won't|will not|wouldn't|would not|denied|declined|rejected|"
          + "rejecting|deny|denying) (?:to )?(?:(?:give|pay|issue|process|send|make|honou?r) )?(?:me |us )?"
          + "(?:a |my |the |any |our )?refund|"
          + "refund (?:request )?(?:was |has been |got |is )?(?:refused|denied|declined|rejected)|"
          + "(?:demand|demanding|insist on|insisting on) (?:a |my |the |an |our )?(?:immediate |full )?"
          + "(?:refund|money back)|want (?:all )?(?:my|our) money back"),

      // Legal matters and complaints to a regulator or an ombudsman.
      new Spec("legal", "legal", GENERAL, SITUATION, "solicitors?|lawyers?|barristers?|attorneys?|legal "
          + "(?:action|proceedings|advice|claim|team|representative|department)|"
          + "(?:take|taking|took|taken) [\\w']+ to court|small claims|court (?:action|case|claim|proceedings|order|"
          + "summons)|see you in court|ombudsman|lawsuit|litigation|letter (?:before|of) (?:action|claim)|"
          + "(?:will|going to|intend to|shall|gonna) sue|suing|without prejudice"),
      new Spec("regulator-complaint", "legal", GENERAL, SITUATION, "(?:complain\\w*|report\\w*|escalat\\w*|"
          + "contact\\w*|writ\\w*|go|going|take|taking|took|refer\\w*) " + gap(4) + "(?:to|with) (?:the |your )?"
          + "(?:[\\w']+ )?(?:regulator|trading standards|ofwat|ofgem|ofcom|fca|financial conduct authority|ccw|"
          + "consumer council for water|cfpb|consumer financial protection bureau|better business bureau|bbb)|"
          + "ofwat|ofgem|financial conduct authority|trading standards"));

  private static final List<Spec> WATER_WASTE_DANGER = List.of(
      // Health: someone unwell after drinking the water. A person, so first among the pack's situations.
      new Spec("health-after-drinking", "health", WATER_WASTE, SITUATION,
          UNWELL + " " + gap(6) + "(?:after|from|since|by|and) " + gap(5)
          + "(?:drinking|drank|drink|water)|"
          + "(?:water|drinking|drank|drink|drinks) " + gap(8) + UNWELL),

      // Sewage: flooding from the sewer is a health hazard, inside or out.
      new Spec("sewage-flooding", "sewage", WATER_WASTE, SITUATION,
          SEWAGE + " (?:(?:is|was|has|had|keeps|kept|are|were|all|just|now) ){0,8}+"
          + "(?:flood\\w*|coming|came|comes|bubbling|bubbled|pouring|poured|overflowing|overflowed|spilling|"
          + "spilled|leaking|leaked|backing up|backed up|seeping|rising|everywhere|(?:all )?over|up through|"
          + "in it|(?:in|into) " + ROOM + ")|"
          + "(?:flood\\w*|overflowing|filled|full|covered|swimming) (?:with |in )?" + SEWAGE),

      // Burst mains: water escaping in a public place, and ground giving way under it.
      new Spec("burst-main", "burst-main", WATER_WASTE, SITUATION, "burst (?:water )?mains?|"
          + "(?:burst|broken|leaking) (?:water )?(?:pipe|main) (?:in|on|under) (?:the )?" + PUBLIC_WAY + "|"
          + "(?:pipe|main) (?:has |had )?burst (?:in|on|under) (?:the )?" + PUBLIC_WAY),
      new Spec("burst-water-in-road", "burst-main", WATER_WASTE, SITUATION,
          "(?:water|leak) (?:(?:is|was|keeps|has been|just) ){0,8}+"
          + "(?:gushing|pouring|spurting|spraying|bubbling|pumping|fountaining|shooting|streaming|flooding|"
          + "running|coming|welling|rushing|leaking)(?: up| out| down)?"
          + "(?: (?:of|through|from|into|onto|across|along|over|under|in|out of))? " + gap(4) + PUBLIC_WAY + "|"
          + "(?:leak|leaking|flood|flooding) (?:in|on|across|along) (?:the )?" + PUBLIC_WAY + "|"
          + "(?:massive|big|huge|major|serious) leak (?:near|outside|by|in|on) (?:the )?(?:" + PUBLIC_WAY
          + "|school|shops|corner)|"
          + PUBLIC_WAY + " (?:is |has |have )?(?:flooding|flooded|under water|sunk|sinking|collapsed|caved in)|"
          + "flooding (?:the|our|my) " + PUBLIC_WAY + "|sink ?holes?"),

      // Water that is contaminated: the situation named. The colours, bits, smells and tastes after it are signs.
      new Spec("wq-contaminated", "water-quality", WATER_WASTE, SITUATION,
          "(?:water|supply) (?:(?:is|was|has been|might be|may be|"
          + "could be|must be|got|getting|become|been) ){0,8}+(?:contaminated|polluted|poisoned|unsafe|not safe)|"
          + "(?:contaminated|polluted|unsafe) (?:tap |drinking )?water|"
          + "(?:contamination|pollution) (?:of|in) (?:the|my|our) (?:tap |drinking )?water|"
          + "something (?:has )?got into the water"),

      // Signs in the tap water: many situations give them (works on the main, a burst, the customer's own pipes).
      new Spec("wq-discoloured", "water-quality", WATER_WASTE, SIGN,
          "dis-?colou?r(?:ed|ation)|" + COLOUR + " (?:tap )?water|"
          + "water " + gap(6) + WATER_VERB + " " + DEGREE + "(?:" + COLOUR + "|dirty|discolou?red)|"
          + "colou?r of (?:weak )?(?:tea|coffee|rust|mud)|"
          + "dirty (?:tap )?water (?:from|out of|coming out of|coming from|in) " + gap(3) + "taps?"),
      new Spec("wq-particles", "water-quality", WATER_WASTE, SIGN, "(?:black|brown|orange) bits|"
          + "bits (?:in|floating in) (?:it|the water|my water|our water)|"
          + "(?:grit|sand|sediment|particles) in (?:the|my|our) (?:tap )?water"),
      new Spec("wq-smell-taste", "water-quality", WATER_WASTE, SIGN,
          "(?:smells?|smelling|smelt|smelled|stinks?|stinking|stank|"
          + "tastes?|tasting|tasted) (?:(?:strongly|really|very|quite|a bit|a little|slightly|horribly|awful|"
          + "and tastes|and smells|of|like) ){0,8}+(?:sewage|sewers?|drains?|chemicals?|petrol|diesel|bleach|oil|"
          + "solvents?|paraffin|kerosene|rotten eggs?|plastic|earth|antiseptic|disinfectant|fuel)|"
          + "(?:strange|chemical|solvent|petrol|diesel|oily|sewage|foul|horrible|disgusting) "
          + "(?:taste|smell|odou?r)s?"),
      new Spec("wq-off-taste", "water-quality", WATER_WASTE, SIGN, "(?:smells?|smelling|smelt|tastes?|tasting|tasted) "
          + "(?:(?:really|very|quite|a bit|a little|so|and tastes|and smells) ){0,8}+(?:off|funny|strange|disgusting|"
          + "horrible|awful|foul|rank|vile|revolting|weird)|"
          + "(?:water|it) " + gap(3) + "(?:smells|stinks)(?! (?:(?:a bit|slightly|a little|faintly) )?"
          + "(?:of|like) (?:a )?(?:swimming pools?|chlorine))"));

  /** Every built-in rule, in the order that breaks ties (see the class description). */
  static final List<Spec> ALL = concat(GENERAL_DANGER, ENERGY_DANGER, WATER_WASTE_DANGER, GENERAL_MONEY_LEGAL);

  /** The built-in rules of the general part and of the given trade packs, in {@link #ALL}'s order. */
  static List<Spec> forPacks(Set<String> tradePacks) {
    return ALL.stream().filter(s -> s.pack().equals(GENERAL) || tradePacks.contains(s.pack())).toList();
  }

  @SafeVarargs
  private static List<Spec> concat(List<Spec>... lists) {
    List<Spec> all = new java.util.ArrayList<>();
    for (List<Spec> list : lists) {
      all.addAll(list);
    }
    return List.copyOf(all);
  }

  private DefaultRules() {
  }
}
