package org.precedent.api.system;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Who may call the service: users with passwords (HTTP basic) and API keys, each with one role.
 * Both come from settings as {@code name:secret:role} entries separated by commas.
 */
final class Credentials {
  static final Set<String> ROLES = Set.of("agent", "manager", "queue");

  /** One configured caller. */
  record Entry(String name, String secret, String role) {}

  private final List<Entry> users;
  private final Map<String, Entry> keysByDigest = new HashMap<>();

  Credentials(String users, String keys) {
    this.users = parse("precedent.security.users", users);
    for (Entry key : parse("precedent.security.keys", keys)) {
      // Looked up by digest so that the lookup time does not depend on how much of a key matched.
      keysByDigest.put(digest(key.secret()), key);
    }
  }

  List<Entry> users() {
    return users;
  }

  Optional<Entry> key(String presented) {
    return Optional.ofNullable(keysByDigest.get(digest(presented)));
  }

  static List<Entry> parse(String setting, String value) {
    List<Entry> out = new ArrayList<>();
    if (value == null || value.isBlank()) {
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

  private static String digest(String s) {
    try {
      byte[] d = MessageDigest.getInstance("SHA-256").digest(s.getBytes(StandardCharsets.UTF_8));
      return java.util.HexFormat.of().formatHex(d);
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException(e);
    }
  }
}
