package org.precedent.engine.safety;

import java.util.List;

/**
 * The built-in term rules, grouped by topic.
 *
 * <p>Patterns are written for questions as {@link SafetyPolicy} prepares them: one space between words, straight
 * apostrophes, matched case-insensitively, and only where the match starts and ends at a word edge. They name the
 * situation, not a lone word, because single words are shared with routine questions: "brown" is also the garden
 * waste bin, "court" is also a street name, "sewerage" is also a line on the bill, "leak" is also a dripping cistern.
 * A rule may fire on a routine question now and then; a missed emergency costs far more than a needless hand-off.
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

  /** One rule before compiling: its id, topic and pattern source. */
  record Spec(String id, String topic, String regex) {
  }

  /** A few words of the same clause: punctuation stops the gap, so matches stay within one thought. */
  private static String gap(int words) {
    return "(?:[\\w']+ ){0," + words + "}";
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

  static final List<Spec> ALL = List.of(
      // Water quality: what comes out of the tap may not be safe to drink.
      new Spec("wq-discoloured", "water-quality", "dis-?colou?r(?:ed|ation)|" + COLOUR + " (?:tap )?water|"
          + "water " + gap(6) + WATER_VERB + " " + DEGREE + "(?:" + COLOUR + "|dirty|discolou?red)|"
          + "colou?r of (?:weak )?(?:tea|coffee|rust|mud)|"
          + "dirty (?:tap )?water (?:from|out of|coming out of|coming from|in) " + gap(3) + "taps?"),
      new Spec("wq-particles", "water-quality", "(?:black|brown|orange) bits|"
          + "bits (?:in|floating in) (?:it|the water|my water|our water)|"
          + "(?:grit|sand|sediment|particles) in (?:the|my|our) (?:tap )?water"),
      new Spec("wq-smell-taste", "water-quality", "(?:smells?|smelling|smelt|smelled|stinks?|stinking|stank|"
          + "tastes?|tasting|tasted) (?:(?:strongly|really|very|quite|a bit|a little|slightly|horribly|awful|"
          + "and tastes|and smells|of|like) ){0,8}+(?:sewage|sewers?|drains?|chemicals?|petrol|diesel|bleach|oil|"
          + "solvents?|paraffin|kerosene|rotten eggs?|plastic|earth|antiseptic|disinfectant|fuel)|"
          + "(?:strange|chemical|solvent|petrol|diesel|oily|sewage|foul|horrible|disgusting) "
          + "(?:taste|smell|odou?r)s?"),
      new Spec("wq-off-taste", "water-quality", "(?:smells?|smelling|smelt|tastes?|tasting|tasted) "
          + "(?:(?:really|very|quite|a bit|a little|so|and tastes|and smells) ){0,8}+(?:off|funny|strange|disgusting|"
          + "horrible|awful|foul|rank|vile|revolting|weird)|"
          + "(?:water|it) " + gap(3) + "(?:smells|stinks)(?! (?:(?:a bit|slightly|a little|faintly) )?"
          + "(?:of|like) (?:a )?(?:swimming pools?|chlorine))"),
      new Spec("wq-contaminated", "water-quality", "(?:water|supply) (?:(?:is|was|has been|might be|may be|"
          + "could be|must be|got|getting|become|been) ){0,8}+(?:contaminated|polluted|poisoned|unsafe|not safe)|"
          + "(?:contaminated|polluted|unsafe) (?:tap |drinking )?water|"
          + "(?:contamination|pollution) (?:of|in) (?:the|my|our) (?:tap |drinking )?water|"
          + "something (?:has )?got into the water"),

      // Sewage: flooding from the sewer is a health hazard, inside or out.
      new Spec("sewage-flooding", "sewage", SEWAGE + " (?:(?:is|was|has|had|keeps|kept|are|were|all|just|now) ){0,8}+"
          + "(?:flood\\w*|coming|came|comes|bubbling|bubbled|pouring|poured|overflowing|overflowed|spilling|"
          + "spilled|leaking|leaked|backing up|backed up|seeping|rising|everywhere|(?:all )?over|up through|"
          + "in it|(?:in|into) " + ROOM + ")|"
          + "(?:flood\\w*|overflowing|filled|full|covered|swimming) (?:with |in )?" + SEWAGE),

      // Burst mains: water escaping in a public place, and ground giving way under it.
      new Spec("burst-main", "burst-main", "burst (?:water )?mains?|"
          + "(?:burst|broken|leaking) (?:water )?(?:pipe|main) (?:in|on|under) (?:the )?" + PUBLIC_WAY + "|"
          + "(?:pipe|main) (?:has |had )?burst (?:in|on|under) (?:the )?" + PUBLIC_WAY),
      new Spec("burst-water-in-road", "burst-main", "(?:water|leak) (?:(?:is|was|keeps|has been|just) ){0,8}+"
          + "(?:gushing|pouring|spurting|spraying|bubbling|pumping|fountaining|shooting|streaming|flooding|"
          + "running|coming|welling|rushing|leaking)(?: up| out| down)?"
          + "(?: (?:of|through|from|into|onto|across|along|over|under|in|out of))? " + gap(4) + PUBLIC_WAY + "|"
          + "(?:leak|leaking|flood|flooding) (?:in|on|across|along) (?:the )?" + PUBLIC_WAY + "|"
          + "(?:massive|big|huge|major|serious) leak (?:near|outside|by|in|on) (?:the )?(?:" + PUBLIC_WAY
          + "|school|shops|corner)|"
          + PUBLIC_WAY + " (?:is |has |have )?(?:flooding|flooded|under water|sunk|sinking|collapsed|caved in)|"
          + "flooding (?:the|our|my) " + PUBLIC_WAY + "|sink ?holes?"),

      // Gas and electricity: not ours, but no answer from a help desk should come before leaving the building.
      new Spec("gas", "gas", "gas (?:leak\\w*|smell|escape)s?|(?:smell|smells|smelling|smelt|smelled|whiff) "
          + "(?:of )?gas|carbon monoxide|co (?:alarm|detector)"),
      new Spec("electricity", "electricity", "electric(?:al|ity)? shocks?|"
          + "(?:got|get|getting|had|gave me|giving me) an? (?:electric(?:al)? )?shock (?:from|off)|"
          + "sparking|sparks (?:coming|flying|from)|"
          + "(?:exposed|bare|live|damaged) (?:electric(?:al)? )?(?:wires?|wiring|cables?)|"
          + "water " + gap(3) + "(?:fuse ?box|consumer unit|electrics|sockets?|light fittings?)|"
          + "(?:fuse ?box|consumer unit|electrics|sockets?) " + gap(2) + "(?:wet|soaked|under water|flooded)"),

      // Health: someone unwell after drinking the water.
      new Spec("health-after-drinking", "health", UNWELL + " " + gap(6) + "(?:after|from|since|by|and) " + gap(5)
          + "(?:drinking|drank|drink|water)|"
          + "(?:water|drinking|drank|drink|drinks) " + gap(8) + UNWELL),

      // Money disputes before legal, so that a county court judgment is reported as a debt matter.
      new Spec("money-dispute", "money-dispute", "bailiffs?|enforcement (?:agents?|officers?)|debt collectors?|"
          + "debt collection agency|county court judge?ments?|ccjs?|compensation claim|"
          + "claim (?:for )?compensation|(?:claim|claiming|seek|seeking|demand|demanding|want|expect|entitled to) "
          + "(?:some |full |financial )?compensation|chargeback"),
      new Spec("legal", "legal", "solicitors?|lawyers?|barristers?|legal (?:action|proceedings|advice|claim|team|"
          + "representative|department)|(?:take|taking|took|taken) [\\w']+ to court|"
          + "small claims|court (?:action|case|claim|proceedings|order|summons)|see you in court|ombudsman|"
          + "lawsuit|litigation|letter (?:before|of) (?:action|claim)|(?:will|going to|intend to|shall|gonna) sue|"
          + "suing|without prejudice"));

  private DefaultRules() {
  }
}
