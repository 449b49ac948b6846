package org.precedent.knowledge.clean;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The organisation's own contact details stay in text; everyone else's are redacted. Numbers are
 * from Ofcom's ranges reserved for drama (01632 960000-960999, and 07700 900000-900999), so none
 * belongs to anyone; the e-mail domain is reserved by RFC 2606 (.example).
 */
class OwnDetailsTest {
  @TempDir
  Path tmp;

  private OwnDetails read(String text) throws IOException {
    Path file = tmp.resolve("own-details.txt");
    Files.writeString(file, text, StandardCharsets.UTF_8);
    return OwnDetails.read(file);
  }

  @Test
  void keepsTheOrganisationsNumberInAnyLayoutAndRedactsACustomers() throws IOException {
    TextCleaner cleaner = TextCleaner.keeping(read("""
        # the 24-hour line and the help-desk address
        phone 01632 960999
        email Help@TarnwickVale.example
        """));
    String reply = "Please call our 24-hour line on 01632-960999 or write to help@tarnwickvale.example;"
        + " we will ring you back on 07700 900123 or mail jo.bloggs@mail.example.";
    assertEquals("Please call our 24-hour line on 01632-960999 or write to help@tarnwickvale.example;"
        + " we will ring you back on [PHONE] or mail [EMAIL].", cleaner.cleanReply(reply));
    // Without the file, both kinds are redacted as before.
    assertEquals("Please call our 24-hour line on [PHONE] or write to [EMAIL]; we will ring you "
        + "back on [PHONE] or mail [EMAIL].", TextCleaner.standard().cleanReply(reply));
    // Cleaning stays idempotent with kept details.
    assertEquals(cleaner.cleanReply(reply), cleaner.cleanReply(cleaner.cleanReply(reply)));
  }

  @Test
  void aMissingFileKeepsNothing() throws IOException {
    assertSame(OwnDetails.NONE, OwnDetails.read(tmp.resolve("absent.txt")));
    assertSame(TextCleaner.standard(), TextCleaner.keeping(OwnDetails.NONE));
  }

  @Test
  void aBadLineIsRefusedNamingFileAndLine() {
    IOException e = assertThrows(IOException.class, () -> read("phone 01632 960999\nphone 12\n"));
    assertTrue(e.getMessage().endsWith("own-details.txt:2: '12' is not a phone number (7 to 15 "
        + "digits, with spaces, dots, hyphens, brackets or a leading +)"), e.getMessage());
    e = assertThrows(IOException.class, () -> read("\n\nfax 01632 960999\n"));
    assertTrue(e.getMessage().contains("own-details.txt:3: expected 'phone VALUE', 'email VALUE' or "
        + "'url VALUE'"),
        e.getMessage());
    e = assertThrows(IOException.class, () -> read("email nobody\n"));
    assertTrue(e.getMessage().contains(":1: 'nobody' is not an e-mail address"), e.getMessage());
    assertThrows(IOException.class, () -> read("phone 01632 960999 ext 12\n"));
    Path notText = tmp.resolve("bytes.txt");
    e = assertThrows(IOException.class, () -> {
      Files.write(notText, new byte[] {'p', 'h', (byte) 0xff});
      OwnDetails.read(notText);
    });
    assertTrue(e.getMessage().endsWith("bytes.txt: not UTF-8 text"), e.getMessage());
  }

  @Test
  void aKeptNumberDoesNotKeepALongerOneThatContainsIt() throws IOException {
    OwnDetails own = read("phone 01632 960999\n");
    assertTrue(own.keepsPhone("(01632) 960999"));
    assertFalse(own.keepsPhone("01632 960998"));
    assertEquals("[PHONE]", TextCleaner.keeping(own).redact("+44 1632 9609990"));
  }

  @Test
  void contactsInListsWhatRedactionWouldReplace() {
    assertEquals(java.util.List.of("help@tarnwickvale.example", "01632 960999"),
        TextCleaner.contactsIn("Mail help@tarnwickvale.example or call 01632  960999 today"));
  }
}
