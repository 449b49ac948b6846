package org.precedent.knowledge.clean;

import java.util.Objects;

/**
 * Turns a raw ticket question or agent reply into the text Precedent learns from: the message's
 * substance only, with personal data replaced by {@link Placeholders}. Instances are immutable and
 * safe to share between threads.
 */
public final class TextCleaner {
  private static final TextCleaner STANDARD =
      new TextCleaner(Redactor.standard(), new MailStripper(false), new MailStripper(true));

  private final Redactor redactor;
  private final MailStripper questions;
  private final MailStripper replies;

  private TextCleaner(Redactor redactor, MailStripper questions, MailStripper replies) {
    this.redactor = redactor;
    this.questions = questions;
    this.replies = replies;
  }

  /** The cleaner with quote, greeting and sign-off stripping and every redaction rule. */
  public static TextCleaner standard() {
    return STANDARD;
  }

  /** The standard cleaner, but leaving the organisation's own contact details in the text. */
  public static TextCleaner keeping(OwnDetails own) {
    return own.isEmpty() ? STANDARD
        : new TextCleaner(Redactor.keeping(own), STANDARD.questions, STANDARD.replies);
  }

  /**
   * The web addresses, e-mail addresses and phone numbers that redaction finds in {@code raw}, as
   * written (before any are kept): what ingest counts to propose the organisation's own details.
   */
  public static java.util.List<String> contactsIn(String raw) {
    return Redactor.contacts(Whitespace.normalise(Objects.requireNonNull(raw, "raw")));
  }

  /** A customer's question without greeting, sign-off, signature or quoted mail, redacted. */
  public String cleanQuestion(String raw) {
    return clean(raw, questions);
  }

  /** An agent's reply, cleaned like a question and also without the stock closing lines. */
  public String cleanReply(String raw) {
    return clean(raw, replies);
  }

  /** Redaction only, leaving everything else as it was; for text about to be logged. */
  public String redact(String text) {
    return redactor.redact(Objects.requireNonNull(text, "text"));
  }

  /*
   * Quoted mail is cut before redaction so long threads are not scanned for nothing. Greetings and
   * sign-offs are judged after redaction, on the text that is returned: a phone number counts as
   * one word then, as it will when the result is cleaned again, so cleaning twice changes nothing.
   * Whitespace is normalised first as well, so that "01632  960456" is seen as a phone number.
   */
  private String clean(String raw, MailStripper stripper) {
    String text = Whitespace.normalise(Objects.requireNonNull(raw, "raw"));
    String redacted = redactor.redact(QuoteCutter.cut(text));
    String stripped = Whitespace.normalise(stripper.strip(redacted));
    if (!stripped.isEmpty()) {
      return stripped;
    }
    // Nothing but greeting and sign-off: the message itself is then the best text there is.
    return Whitespace.normalise(redactor.redact(text));
  }
}
