/**
 * Text cleaning and privacy redaction for tickets before they are indexed or logged.
 *
 * <p>How to use:
 *
 * <pre>{@code
 * TextCleaner cleaner = TextCleaner.standard();
 * String question = cleaner.cleanQuestion(rawCustomerMail); // substance only, redacted
 * String reply = cleaner.cleanReply(rawAgentReply);         // also drops stock closing lines
 * log.info("ingesting {}", cleaner.redact(anything));       // redaction only, nothing stripped
 * }</pre>
 *
 * <p>Cleaning cuts quoted earlier messages ('>' lines, "On ... wrote:", "-----Original
 * Message-----", "From: ... Sent: ..."), the signature after "--" and mobile footers, then redacts,
 * then removes greetings and sign-offs, then normalises whitespace. If nothing would be left, the
 * redacted original is kept. Cleaning is idempotent.
 *
 * <p>Redaction replaces, in this order, e-mail addresses, IBANs passing mod 97 ({@link
 * org.precedent.knowledge.clean.Iban}), card numbers passing the Luhn check ({@link
 * org.precedent.knowledge.clean.Luhn}), the demo's TVW account numbers and phone numbers (E.164,
 * UK national, NANP) with the typed {@link org.precedent.knowledge.clean.Placeholders}. Dates,
 * amounts, ticket references, meter readings, postcodes and times are left alone.
 *
 * <p>The package depends on the JDK alone and on no other package of Precedent, so that anything
 * that handles customers' text (ingest, the decision, the service's logs) can use it.
 */
package org.precedent.knowledge.clean;
