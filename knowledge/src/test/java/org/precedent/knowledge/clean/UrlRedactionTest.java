package org.precedent.knowledge.clean;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Web addresses: a customer's become [URL], the organisation's own stay. Host names are under
 * .example and example.org, reserved for documentation by RFC 2606 section 3.
 */
class UrlRedactionTest {
  @TempDir
  Path tmp;

  private final TextCleaner standard = TextCleaner.standard();

  private OwnDetails read(String text) throws IOException {
    Path file = tmp.resolve("own-details.txt");
    Files.writeString(file, text, StandardCharsets.UTF_8);
    return OwnDetails.read(file);
  }

  /**
   * RFC 3986 section 1.1.2 ("Examples"), every URI it lists. Those with an authority ("//") are
   * web addresses and become [URL] whole, IPv6 literal and query included; mailto: and tel: hold
   * an e-mail address and a phone number, which their own rules redact; news: and urn: name no
   * person and stay.
   */
  @Test
  void theExamplesOfRfc3986Section112() {
    for (String uri : List.of("ftp://ftp.is.co.za/rfc/rfc1808.txt",
        "http://www.ietf.org/rfc/rfc2396.txt", "ldap://[2001:db8::7]/c=GB?objectClass?one",
        "telnet://192.0.2.16:80/")) {
      assertTrue(UrlRule.isUrl(uri), uri);
      assertEquals(List.of(uri), TextCleaner.contactsIn("see " + uri + " today"), uri);
      assertEquals("see [URL] today", standard.redact("see " + uri + " today"), uri);
    }
    assertEquals("write to mailto:[EMAIL]", standard.redact("write to mailto:John.Doe@example.com"));
    assertEquals("ring tel:[PHONE]", standard.redact("ring tel:+1-816-555-1212"));
    for (String named : List.of("news:comp.infosystems.www.servers.unix",
        "urn:oasis:names:specification:docbook:dtd:xml:4.1.2")) {
      assertFalse(UrlRule.isUrl(named), named);
      assertEquals("read " + named, standard.redact("read " + named));
    }
  }

  /**
   * RFC 3986 section 2: percent-encodings, sub-delimiters and a fragment are part of the address;
   * the full stop, comma or bracket that closes the sentence around it is not (RFC 3986 appendix C
   * leaves that to the text: common practice, no source).
   */
  @Test
  void theAddressEndsWhereTheSentenceTakesOver() {
    assertEquals("My photos are at [URL]. Thanks", standard.redact(
        "My photos are at https://photos.example.net/a%20b/c;v=1?x=1&y=(2)#top. Thanks"));
    assertEquals("(see [URL]), or [URL], then", standard.redact(
        "(see https://shop.example/item_(blue)), or www.jo-bloggs.example/cv, then"));
    // Not addresses: a scheme alone, a word that merely ends in "www", an e-mail address.
    assertEquals("type http:// then the site", standard.redact("type http:// then the site"));
    assertEquals("mail [EMAIL] please", standard.redact("mail jo@www.example.org please"));
    assertEquals("the awww.nothing here", standard.redact("the awww.nothing here"));
  }

  @Test
  void theOrganisationsOwnSiteStaysAndACustomersGoes() throws IOException {
    OwnDetails own = read("""
        # the site's help pages and the payment page
        url https://www.TarnwickVale.example/help
        url www.tarnwickvale-pay.example
        """);
    TextCleaner cleaner = TextCleaner.keeping(own);
    String reply = "Read http://tarnwickvale.example/help/leaks#meter, pay at "
        + "https://tarnwickvale-pay.example/now?ref=1, not https://www.tarnwickvale.example/helpdesk"
        + " nor your https://my-blog.example/flood-photos.";
    assertEquals("Read http://tarnwickvale.example/help/leaks#meter, pay at "
        + "https://tarnwickvale-pay.example/now?ref=1, not [URL] nor your [URL].",
        cleaner.cleanReply(reply));
    assertEquals(cleaner.cleanReply(reply), cleaner.cleanReply(cleaner.cleanReply(reply)));
    // A customer's number in the query of the organisation's own page is still redacted.
    assertEquals("see https://tarnwickvale.example/help?call=[PHONE] now",
        cleaner.redact("see https://tarnwickvale.example/help?call=07700900123 now"));
    assertTrue(own.keepsUrl("HTTPS://user@TARNWICKVALE.example:443/help/"));
    assertFalse(own.keepsUrl("https://tarnwickvale.example/Help"), "a path is case-sensitive");
  }

  @Test
  void aBadUrlLineIsRefusedNamingFileAndLine() {
    IOException e = assertThrows(IOException.class, () -> read("phone 01632 960999\nurl help\n"));
    assertTrue(e.getMessage().endsWith("own-details.txt:2: 'help' is not a web address (a scheme "
        + "and '://' or 'www.', then the site, as in https://www.example.org/help)"),
        e.getMessage());
  }

  /** Linear in the text: 100 KB of scheme-like and address-like runs. */
  @Test
  void hostileRunsAreRedactedQuickly() {
    String text = "http://".repeat(5000) + "www.".repeat(5000) + ")".repeat(20000)
        + ("https://a.example/" + ")".repeat(3000) + " ").repeat(10);
    long start = System.nanoTime();
    String out = standard.redact(text);
    long millis = (System.nanoTime() - start) / 1_000_000;
    assertTrue(out.contains("[URL]"), out.substring(0, 200));
    // A generous bound for a shared machine (common practice, no source): quadratic work on
    // these lengths takes minutes.
    assertTrue(millis < 2000, millis + " ms");
  }
}
