package org.precedent.api.system;

import java.nio.charset.StandardCharsets;
import java.security.GeneralSecurityException;
import java.security.MessageDigest;
import java.security.SecureRandom;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.atomic.AtomicLong;
import java.util.regex.Pattern;
import javax.crypto.Mac;
import javax.crypto.spec.SecretKeySpec;
import org.springframework.security.crypto.bcrypt.BCryptPasswordEncoder;

/**
 * Who may call the service: users with passwords (HTTP basic) and API keys, each with one role.
 * Both come from settings as {@code name:secret:role} entries separated by commas. When neither
 * setting names anyone, the built-in demo credentials are in force; naming anyone in either
 * setting replaces all of them.
 *
 * <p>A secret written in plain text is kept only as its HMAC-SHA256 under a key drawn at random at
 * start, and a presented secret is compared with it in constant time: one HMAC per request, no
 * slow hash. A password may instead be given bcrypt-encoded ({@code {bcrypt}$2a$10$...}); it is
 * then checked with bcrypt on each request. Every password check does the same work whether the
 * name is known, unknown, or has the other kind of secret, so the time of an answer does not tell
 * which names exist.
 */
final class Credentials {
  static final Set<String> ROLES = Set.of("agent", "manager", "queue");
  static final String DEMO_USERS = "agent:agent-demo-password:agent,"
      + "manager:manager-demo-password:manager,queue:queue-demo-password:queue";
  static final String DEMO_KEYS = "agent-key:demo-agent-key:agent,"
      + "manager-key:demo-manager-key:manager,queue-key:demo-queue-key:queue";
  private static final String BCRYPT = "{bcrypt}";
  /** How an encoded secret starts: its encoding's name in braces. */
  private static final Pattern ENCODING = Pattern.compile("\\A\\{[\\w@.-]+}");
  /** The form {@link BCryptPasswordEncoder} accepts; anything else would never match. */
  private static final Pattern BCRYPT_HASH =
      Pattern.compile("\\A\\$2(a|y|b)?\\$(\\d\\d)\\$[./0-9A-Za-z]{53}\\z");

  /** One configured caller, as read from the settings. */
  record Entry(String name, String secret, String role) {
    @Override
    public String toString() {
      return name + ":...:" + role;
    }
  }

  /** A caller who proved who they are. */
  record Caller(String name, String role) {}

  /** How much checking work was done, for the tests of equal work. */
  record Work(long digests, long bcryptChecks) {}

  /** A stored secret: its HMAC, or (bcrypt only) its encoded form. */
  private record Secret(Caller caller, byte[] digest, String bcrypt) {}

  private final boolean demo;
  private final byte[] hmacKey = new byte[32];
  private final Map<String, Secret> users = new HashMap<>();
  private final List<Secret> keys = new ArrayList<>();
  private final BCryptPasswordEncoder bcrypt = new BCryptPasswordEncoder();
  /** Checked in place of an unknown name's secret. */
  private final byte[] dummyDigest;
  /** A configured bcrypt hash, checked by every password check when any user has one. */
  private final String dummyBcrypt;
  private final AtomicLong digests = new AtomicLong();
  private final AtomicLong bcryptChecks = new AtomicLong();

  private Credentials(List<Entry> users, List<Entry> keys, boolean demo) {
    this.demo = demo;
    new SecureRandom().nextBytes(hmacKey);
    String firstBcrypt = null;
    for (Entry u : users) {
      Caller caller = new Caller(u.name(), u.role());
      Secret s;
      if (u.secret().startsWith(BCRYPT)) {
        String hash = u.secret().substring(BCRYPT.length());
        s = new Secret(caller, null, hash);
        firstBcrypt = firstBcrypt == null ? hash : firstBcrypt;
      } else {
        s = new Secret(caller, hmac(plain(u)), null);
      }
      this.users.put(u.name(), s);
    }
    for (Entry k : keys) {
      this.keys.add(new Secret(new Caller(k.name(), k.role()), hmac(k.secret()), null));
    }
    byte[] random = new byte[32];
    new SecureRandom().nextBytes(random);
    this.dummyDigest = hmac(java.util.HexFormat.of().formatHex(random));
    this.dummyBcrypt = firstBcrypt;
    digests.set(0);
  }

  /**
   * The credentials the settings name: {@code users} and {@code keys} as {@code name:secret:role}
   * lists. When both are blank, the demo credentials.
   */
  static Credentials fromSettings(String users, String keys) {
    boolean demo = isBlank(users) && isBlank(keys);
    List<Entry> u = parse("precedent.security.users", demo ? DEMO_USERS : users);
    List<Entry> k = parse("precedent.security.keys", demo ? DEMO_KEYS : keys);
    for (Entry e : u) {
      String s = e.secret();
      java.util.regex.Matcher encoding = ENCODING.matcher(s);
      if (encoding.find() && !s.startsWith(BCRYPT) && !s.startsWith("{noop}")) {
        throw new IllegalArgumentException("precedent.security.users: the password of " + e.name()
            + " starts with '" + encoding.group() + "': only {bcrypt} encoded passwords are "
            + "understood (or plain text)");
      }
      if (s.startsWith(BCRYPT) && !BCRYPT_HASH.matcher(s.substring(BCRYPT.length())).matches()) {
        throw new IllegalArgumentException("precedent.security.users: the password of " + e.name()
            + " is not a bcrypt hash ({bcrypt}$2a$NN$ and 53 characters)");
      }
    }
    unique("precedent.security.users", "user name", u.stream().map(Entry::name).toList());
    unique("precedent.security.keys", "key name", k.stream().map(Entry::name).toList());
    unique("precedent.security.keys", "key", k.stream().map(Entry::secret).toList());
    return new Credentials(u, k, demo);
  }

  /** Whether the built-in demo credentials are the ones in force. */
  boolean demo() {
    return demo;
  }

  /** Whether {@code name} is a configured user; for logging, never for the answer's content. */
  boolean isUser(String name) {
    return users.containsKey(name);
  }

  /** The user with this name and password, if both are right. */
  Optional<Caller> user(String name, String password) {
    Secret known = users.get(name);
    // The same work for every name: one HMAC and, when bcrypt is in use, one bcrypt check.
    byte[] presented = hmac(password);
    boolean digestMatches = MessageDigest.isEqual(presented,
        known != null && known.digest() != null ? known.digest() : dummyDigest);
    boolean bcryptMatches = false;
    if (dummyBcrypt != null) {
      bcryptChecks.incrementAndGet();
      try {
        bcryptMatches = bcrypt.matches(password,
            known != null && known.bcrypt() != null ? known.bcrypt() : dummyBcrypt);
      } catch (IllegalArgumentException tooLong) {
        // bcrypt refuses passwords over 72 bytes, for every name alike.
      }
    }
    if (known == null) {
      return Optional.empty();
    }
    boolean right = known.bcrypt() != null ? bcryptMatches : digestMatches;
    return right ? Optional.of(known.caller()) : Optional.empty();
  }

  /** The caller whose API key this is. */
  Optional<Caller> key(String presented) {
    byte[] digest = hmac(presented);
    Caller found = null;
    // Every key is compared, in constant time, so the answer takes as long whichever one matched.
    for (Secret k : keys) {
      if (MessageDigest.isEqual(digest, k.digest())) {
        found = k.caller();
      }
    }
    return Optional.ofNullable(found);
  }

  Work work() {
    return new Work(digests.get(), bcryptChecks.get());
  }

  static List<Entry> parse(String setting, String value) {
    List<Entry> out = new ArrayList<>();
    if (isBlank(value)) {
      return out;
    }
    for (String item : value.split(",")) {
      String[] parts = item.strip().split(":", 3);
      if (parts.length != 3 || parts[0].isBlank() || parts[1].isBlank()) {
        throw new IllegalArgumentException(setting + ": '" + item.strip().replaceAll(":.*", ":...")
            + "' is not name:secret:role");
      }
      String role = parts[2].strip().toLowerCase(Locale.ROOT);
      if (!ROLES.contains(role)) {
        throw new IllegalArgumentException(setting + ": role '" + parts[2].strip() + "' of "
            + parts[0].strip() + " is not one of agent, manager, queue");
      }
      out.add(new Entry(parts[0].strip(), parts[1].strip(), role));
    }
    return out;
  }

  private static String plain(Entry user) {
    return user.secret().startsWith("{noop}") ? user.secret().substring("{noop}".length())
        : user.secret();
  }

  private static void unique(String setting, String what, List<String> values) {
    Set<String> seen = new HashSet<>();
    for (int i = 0; i < values.size(); i++) {
      if (!seen.add(values.get(i))) {
        // A repeated key is not named: it is a secret.
        throw new IllegalArgumentException(setting + ": " + what + (what.equals("key")
            ? " number " + (i + 1) : " '" + values.get(i) + "'") + " appears twice");
      }
    }
  }

  private static boolean isBlank(String s) {
    return s == null || s.isBlank();
  }

  private byte[] hmac(String s) {
    digests.incrementAndGet();
    try {
      Mac mac = Mac.getInstance("HmacSHA256");
      mac.init(new SecretKeySpec(hmacKey, "HmacSHA256"));
      return mac.doFinal(s.getBytes(StandardCharsets.UTF_8));
    } catch (GeneralSecurityException e) {
      throw new IllegalStateException("every Java runtime has HmacSHA256", e);
    }
  }
}
