package org.precedent.api.system;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.springframework.security.crypto.bcrypt.BCryptPasswordEncoder;

/** Which credentials are in force, and that checking a password costs the same for every name. */
class CredentialsTest {
  static final Credentials.Caller ANA = new Credentials.Caller("ana", "manager");

  @Test
  void withNothingConfiguredTheDemoCredentialsAreInForce() {
    Credentials demo = Credentials.fromSettings("", " ");
    assertTrue(demo.demo());
    assertTrue(demo.user("manager", "manager-demo-password").isPresent());
    assertTrue(demo.key("demo-manager-key").isPresent());
  }

  @Test
  void usersAloneSwitchOffTheDemoKeysAndKeysAloneTheDemoUsers() {
    Credentials users = Credentials.fromSettings("ana:ana-pw-1:manager", "");
    assertFalse(users.demo());
    assertEquals(Optional.empty(), users.key("demo-manager-key"));
    assertEquals(Optional.empty(), users.user("manager", "manager-demo-password"));
    assertEquals(Optional.of(ANA), users.user("ana", "ana-pw-1"));

    Credentials keys = Credentials.fromSettings(null, "ops:ops-key-1:manager");
    assertFalse(keys.demo());
    assertEquals(Optional.empty(), keys.user("manager", "manager-demo-password"));
    assertEquals(Optional.empty(), keys.key("demo-manager-key"));
    assertEquals(Optional.of(new Credentials.Caller("ops", "manager")), keys.key("ops-key-1"));
  }

  @Test
  void plainPasswordsCostOneDigestForKnownAndUnknownNamesAlike() {
    Credentials c = Credentials.fromSettings("ana:ana-pw-1:manager,bo:bo-pw-2:agent", "");
    for (String[] attempt : new String[][] {{"ana", "ana-pw-1"}, {"ana", "wrong"},
        {"nobody", "wrong"}, {"nobody", "ana-pw-1"}, {"", ""}}) {
      Credentials.Work before = c.work();
      c.user(attempt[0], attempt[1]);
      assertEquals(new Credentials.Work(before.digests() + 1, 0), c.work(),
          attempt[0] + " / " + attempt[1]);
    }
    assertEquals(Optional.empty(), c.user("nobody", "ana-pw-1"));
    assertEquals(Optional.empty(), c.user("bo", "ana-pw-1"));
  }

  @Test
  void withABcryptUserEveryCheckDoesOneDigestAndOneBcrypt() {
    // Strength 4, the least bcrypt allows, keeps the test quick; the work counted is the same.
    String hash = new BCryptPasswordEncoder(4).encode("bo-pw-2");
    Credentials c = Credentials.fromSettings("ana:ana-pw-1:manager,bo:{bcrypt}" + hash + ":agent",
        "");
    for (String[] attempt : new String[][] {{"ana", "ana-pw-1"}, {"ana", "wrong"},
        {"bo", "bo-pw-2"}, {"bo", "wrong"}, {"nobody", "bo-pw-2"}}) {
      Credentials.Work before = c.work();
      c.user(attempt[0], attempt[1]);
      assertEquals(new Credentials.Work(before.digests() + 1, before.bcryptChecks() + 1),
          c.work(), attempt[0] + " / " + attempt[1]);
    }
    assertEquals(Optional.of(new Credentials.Caller("bo", "agent")), c.user("bo", "bo-pw-2"));
    assertEquals(Optional.empty(), c.user("nobody", "bo-pw-2"));
    assertEquals(Optional.empty(), c.user("ana", "bo-pw-2"));
    assertEquals(Optional.of(ANA), c.user("ana", "ana-pw-1"));
  }

  @Test
  void aKeyCheckIsOneDigestWhicheverKeyMatches() {
    Credentials c = Credentials.fromSettings("", "a:key-a:agent,m:key-m:manager,q:key-q:queue");
    for (String presented : new String[] {"key-a", "key-q", "nope"}) {
      long before = c.work().digests();
      c.key(presented);
      assertEquals(before + 1, c.work().digests(), presented);
    }
    assertEquals("q", c.key("key-q").orElseThrow().name());
  }

  @Test
  void noopPasswordsArePlainAndOtherEncodingsAreRefusedAtStart() {
    assertEquals(Optional.of(ANA),
        Credentials.fromSettings("ana:{noop}ana-pw-1:manager", "").user("ana", "ana-pw-1"));
    var scrypt = assertThrows(IllegalArgumentException.class,
        () -> Credentials.fromSettings("ana:{scrypt}abc:manager", ""));
    assertTrue(scrypt.getMessage().contains("ana") && scrypt.getMessage().contains("{scrypt}"),
        scrypt.getMessage());
    var bad = assertThrows(IllegalArgumentException.class,
        () -> Credentials.fromSettings("ana:{bcrypt}not-a-hash:manager", ""));
    assertTrue(bad.getMessage().contains("not a bcrypt hash"), bad.getMessage());
    // A password that merely starts with a brace is a plain password.
    assertTrue(Credentials.fromSettings("ana:{x:manager", "").user("ana", "{x").isPresent());
  }

  @Test
  void repeatedNamesAndKeysAreRefusedWithoutShowingTheKey() {
    var names = assertThrows(IllegalArgumentException.class,
        () -> Credentials.fromSettings("ana:a:agent,ana:b:manager", ""));
    assertTrue(names.getMessage().contains("'ana' appears twice"), names.getMessage());
    var keys = assertThrows(IllegalArgumentException.class,
        () -> Credentials.fromSettings("", "a:same-key:agent,b:same-key:manager"));
    assertTrue(keys.getMessage().contains("key number 2 appears twice"), keys.getMessage());
    assertFalse(keys.getMessage().contains("same-key"), keys.getMessage());
  }

  @Test
  void anEntryNeverPrintsItsSecret() {
    assertEquals("ana:...:manager", new Credentials.Entry("ana", "pw", "manager").toString());
  }
}
