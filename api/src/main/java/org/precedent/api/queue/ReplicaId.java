package org.precedent.api.queue;

import java.net.InetAddress;
import java.net.UnknownHostException;
import java.security.SecureRandom;
import java.util.HexFormat;

/**
 * The id a replica stamps on its claims ({@code precedent.replica.id}). Unset, it is the host's
 * name and a random part drawn at start: two replicas on one host differ, and a restarted replica
 * is a new one, whose old claims wait for their lease to end. A team that names its replicas
 * (one id per machine or container, kept across restarts) gets a restarted replica's claims back
 * at once.
 */
final class ReplicaId {
  static final int MAX_CHARS = 100;

  private ReplicaId() {
  }

  static String orGenerated(String configured) {
    String id = configured == null ? "" : configured.strip();
    if (id.isEmpty()) {
      byte[] random = new byte[4];
      new SecureRandom().nextBytes(random);
      String host;
      try {
        host = InetAddress.getLocalHost().getHostName();
      } catch (UnknownHostException e) {
        host = "replica";
      }
      host = host.length() > 80 ? host.substring(0, 80) : host;
      return host + "-" + HexFormat.of().formatHex(random);
    }
    if (id.length() > MAX_CHARS || !id.chars().allMatch(ch -> ch > 0x20 && ch < 0x7f)) {
      throw new IllegalArgumentException("precedent.replica.id must be 1 to " + MAX_CHARS
          + " printable ASCII characters without spaces, not '" + id + "'");
    }
    return id;
  }
}
