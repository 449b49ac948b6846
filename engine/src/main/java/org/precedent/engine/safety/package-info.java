/**
 * Safety rules: which tickets Precedent must never answer on its own, however confident it is, and the caution the
 * customer sees instead.
 *
 * <p>Where an answer could hurt someone (a customer in distress, danger to life, gas, electricity, water that may be
 * unsafe to drink, sewage, burst mains, an account someone else has got into, a lost or stolen card, fraud, a
 * disputed charge, refund or debt, legal matters and complaints to a regulator), a wrong or merely late automatic
 * reply costs far more than a needless hand-off, so {@link org.precedent.engine.safety.SafetyPolicy#check} runs
 * before the reply threshold and any finding means HAND_OFF. A ticket is human-only when
 *
 * <ul>
 *   <li>a term rule matches the question (cleaned and redacted upstream). Matching ignores case, treats any run of
 *       white space as one space and curly apostrophes as straight ones, and only matches whole words. Rules name a
 *       situation ("brown water", "sewage coming up", "smell gas", "my card was stolen"), not a lone word, because
 *       lone words are shared with routine questions: the brown bin, the sewerage line on a bill, a street called
 *       Kestrel Court, a stolen wheelie bin, a frozen pipe. For the same reason "court" alone is not a legal term;
 *       "take you to court" and "small claims" are;
 *   <li>its category is human-only (categories compared in lower case); or
 *   <li>the proposed answer group has been marked human-only by a manager.
 * </ul>
 *
 * <p>Every caution ends by saying that a person will follow up and that local public-health notices and
 * emergency-service instructions come first ({@link org.precedent.engine.safety.Cautions}).
 *
 * <h2>Built-in rules: the general part and trade packs</h2>
 *
 * <p>The <b>general part</b> is for any help desk: a customer in distress (self-harm language, with a caution
 * pointing to emergency help), danger to life or health (fire, injury, a medical emergency, abuse), gas and electric
 * shocks, account compromise and requests to freeze an account, lost or stolen means of payment, fraud, disputed
 * charges, refunds and debts, legal action, and complaints to a regulator or ombudsman. <b>Trade packs</b> add what
 * only some trades hear: {@code water-waste} (water quality, sewage, burst mains, illness after drinking the water)
 * and {@code energy} (power lines down, households relying on medical equipment or at risk without heat or power,
 * disconnection). Without a policy file, and in a file without {@code trade-packs}, every pack applies: nobody has
 * said what trade the desk serves, and what a pack names puts someone at risk whichever desk hears of it.
 *
 * <h2>When several rules match</h2>
 *
 * <p>Every rule is tried, and the finding lists all that match. Each rule declares a specificity: it names the
 * {@code situation} itself (sewage flooding, a gas leak, a stolen card, a threat to sue), or only a {@code sign}
 * that several situations produce (a foul smell, brown water, a charge the customer does not recognise). Matches
 * are ordered situations first, then signs, and among equals in the policy's rule order; the built-in rules run
 * from the most urgent risk to the least (a life, then health, then money, then legal matters). The first match
 * gives the finding's rule, topic and matched text; the caution holds every matched topic's advice, the first
 * match's first, each once. Specificity comes first because a sign does not say what is happening and a situation
 * does: "sewage coming up through the drain and it smells awful" is sewage, and the smell is what sewage smells
 * like, so the sewage advice is what the customer needs first, and the water caution still follows it.
 *
 * <h2>Policy file</h2>
 *
 * <p>UTF-8 text, one entry a line. Blank lines and lines starting with {@code #} are ignored (a {@code #} later in a
 * line is part of it, so patterns may use it).
 *
 * <pre>
 * emergency-line = 01632 960999           # cautions say "call our emergency line on 01632 960999"
 * include-defaults = true                 # keep the built-in rules (the default when absent)
 * trade-packs = water-waste, energy       # packs added to the general part; "none" for none; all when absent
 * human-only-category = safety            # repeatable; one word each
 * human-only-group = a-1234abcd           # repeatable; one word each
 * rule &lt;id&gt; | &lt;topic&gt; | &lt;pattern&gt;      # a rule naming a situation; the pattern is the rest of the line
 * rule &lt;id&gt; sign | &lt;topic&gt; | &lt;pattern&gt; # a rule naming only a sign ("situation" may be written too)
 * caution &lt;topic&gt; | &lt;text&gt;              # the text for a topic; {emergency-line} is filled in
 * </pre>
 *
 * <ul>
 *   <li>Ids and topics are lower-case letters, digits, {@code .}, {@code _} and {@code -}. A pattern is a Java
 *       regular expression, wrapped so that it matches whole words, case-insensitively, against the prepared
 *       question; write single spaces between words. Write a repeated group bounded and possessive, as the
 *       built-in rules do ({@code (?:(?:very|really) ){0,8}+}): java.util.regex recurses once per repetition of a
 *       plain {@code (...)*}, so a long question could overflow the stack, and that question then cannot be
 *       decided (a queued ticket is marked failed, for a person to take).
 *   <li>A file rule with the id of a built-in rule replaces it in its place; other rules come after the built-in
 *       ones, in file order. That order breaks ties between rules of the same specificity.
 *   <li>A rule's caution is the file's caution for its topic if there is one, else the built-in text for the topic,
 *       else the general caution. The closing sentence is always added, so a file cannot leave it out.
 *   <li>Without {@code emergency-line}, cautions say "our emergency line".
 * </ul>
 *
 * <p>A wrong line (unknown setting, missing part, bad id, a specificity other than {@code situation} or
 * {@code sign}, an unknown trade pack, {@code trade-packs} with {@code include-defaults = false}, a pattern that does
 * not compile, a setting or rule given twice, a caution for a topic no rule has) stops the load with an
 * {@link java.io.IOException} whose message starts with {@code file:line:}, for example
 * {@code safety.rules:12: bad pattern for rule burst-main: Unclosed group near index 17 of '...'}. Nothing is
 * loaded from a bad file.
 *
 * <p>{@code demo-data/safety.rules} is the policy of the invented demo utility.
 *
 * <p>The package depends on the JDK and on {@code knowledge.ticket} alone (the category rule; the
 * question reaches it already cleaned, as text); the decision and the evaluation depend on it.
 */
package org.precedent.engine.safety;
