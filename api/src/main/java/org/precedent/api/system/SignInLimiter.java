package org.precedent.api.system;

import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.HexFormat;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.Optional;
import java.util.function.LongSupplier;
import java.util.regex.Pattern;
import org.precedent.knowledge.io.AtomicFiles;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.stereotype.Component;

/**
 * Limits failed sign-ins, in a sliding window: at most {@code perAddress} failures from one client
 * address and {@code perName} for one user name in any {@code window}. Past that, attempts are
 * refused at once, without checking what they present, until the oldest failure of the window has
 * aged out of it. Successful sign-ins are not counted.
 *
 * <p>Each table keeps at most {@code tracked} addresses or names, whatever an attacker sends:
 * entries with no failure left in the window are dropped, and when the table is still full the
 * entry whose latest failure is oldest makes room. Pushing a name out of the table thus takes
 * {@code tracked} other failing names within one window, which the per-address limit spreads over
 * {@code tracked / perAddress} addresses.
 */
@Component
class SignInLimiter {
  /** IPv6 literals: only these are parsed, so that no text ever leads to a name lookup. */
  private static final Pattern IPV6 = Pattern.compile("[0-9A-Fa-f:.]+");
  private static final int LONGEST_KEY = 64;

  /** Why an attempt is refused, and for how many more seconds. */
  record Refusal(String detail, long retryAfterSeconds) {}

  private final Table addresses;
  private final Table names;
  private final LongSupplier clock;

  @Autowired
  SignInLimiter(@Value("${precedent.security.failed-sign-ins.per-address}") int perAddress,
      @Value("${precedent.security.failed-sign-ins.per-name}") int perName,
      @Value("${precedent.security.failed-sign-ins.window}") Duration window,
      @Value("${precedent.security.failed-sign-ins.tracked}") int tracked) {
    this(perAddress, perName, window, tracked, System::nanoTime);
  }

  SignInLimiter(int perAddress, int perName, Duration window, int tracked, LongSupplier nanoClock) {
    if (perAddress < 1 || perName < 1 || tracked < 1 || window.isNegative() || window.isZero()) {
      throw new IllegalArgumentException("precedent.security.failed-sign-ins: per-address, "
          + "per-name and tracked must be at least 1 and the window longer than zero");
    }
    this.addresses = new Table(perAddress, window.toNanos(), tracked);
    this.names = new Table(perName, window.toNanos(), tracked);
    this.clock = nanoClock;
  }

  /** Whether an attempt from {@code address}, for {@code name} (null with an API key), waits. */
  Optional<Refusal> refusal(String address, String name) {
    long now = clock.getAsLong();
    long byAddress = addresses.waitNanos(addressKey(address), now);
    long byName = name == null ? 0 : names.waitNanos(nameKey(name), now);
    if (byAddress == 0 && byName == 0) {
      return Optional.empty();
    }
    String detail = byAddress >= byName ? "too many failed sign-ins from " + address
        : "too many failed sign-ins for this user name";
    return Optional.of(new Refusal(detail, seconds(Math.max(byAddress, byName))));
  }

  /**
   * Counts a failed sign-in. Returns the refusal that starts with it, when this failure used up an
   * allowance.
   */
  Optional<Refusal> failed(String address, String name) {
    long now = clock.getAsLong();
    addresses.fail(addressKey(address), now);
    if (name != null) {
      names.fail(nameKey(name), now);
    }
    return refusal(address, name);
  }

  /** How many addresses and names are tracked now, each at most {@code tracked}. */
  int[] tracked() {
    return new int[] {addresses.size(), names.size()};
  }

  /**
   * The key an address is counted under: IPv6 addresses by their /64 network, which one end site
   * is usually given whole (common practice), so that one client cannot step through addresses.
   */
  static String addressKey(String address) {
    if (address.indexOf(':') >= 0 && IPV6.matcher(address).matches()) {
      try {
        byte[] bytes = java.net.InetAddress.getByName(address).getAddress();
        if (bytes.length == 16) {
          return HexFormat.of().formatHex(bytes, 0, 8) + "::/64";
        }
      } catch (java.net.UnknownHostException notAnAddress) {
        // counted as the text it is
      }
    }
    return bounded(address);
  }

  private static String nameKey(String name) {
    return bounded(name);
  }

  /** Long text (names are the caller's choice) is kept as its digest, so entries stay small. */
  private static String bounded(String s) {
    if (s.length() <= LONGEST_KEY) {
      return s;
    }
    return "#" + HexFormat.of().formatHex(AtomicFiles.sha256().digest(
        s.getBytes(StandardCharsets.UTF_8)));
  }

  private static long seconds(long nanos) {
    return Math.max(1, (nanos + 999_999_999L) / 1_000_000_000L);
  }

  /** Recent failures per key, in the order of each key's latest failure. */
  private static final class Table {
    private final int limit;
    private final long windowNanos;
    private final int capacity;
    private final LinkedHashMap<String, Recent> recent = new LinkedHashMap<>();

    Table(int limit, long windowNanos, int capacity) {
      this.limit = limit;
      this.windowNanos = windowNanos;
      this.capacity = capacity;
    }

    synchronized long waitNanos(String key, long now) {
      Recent r = recent.get(key);
      if (r == null || r.count < limit) {
        return 0;
      }
      // The ring is full: its oldest entry is the limit-th latest failure.
      return Math.max(0, r.times[r.next] + windowNanos - now);
    }

    synchronized void fail(String key, long now) {
      for (Iterator<Recent> it = recent.values().iterator(); it.hasNext(); ) {
        if (now - it.next().latest() < windowNanos) {
          break;
        }
        it.remove();
      }
      Recent r = recent.remove(key);
      if (r == null) {
        if (recent.size() >= capacity) {
          Iterator<Recent> eldest = recent.values().iterator();
          eldest.next();
          eldest.remove();
        }
        r = new Recent(limit);
      }
      r.add(now);
      recent.put(key, r);
    }

    synchronized int size() {
      return recent.size();
    }
  }

  /**
   * The latest {@code limit} failure times of one key, in a ring that grows with them: a key with
   * one failure holds one time, whatever the limit.
   */
  private static final class Recent {
    final int limit;
    long[] times = new long[1];
    int count;
    /** Once {@code count == limit}: where the oldest time is, and the next one goes. */
    int next;

    Recent(int limit) {
      this.limit = limit;
    }

    void add(long now) {
      if (count < limit) {
        if (count == times.length) {
          times = java.util.Arrays.copyOf(times, (int) Math.min(limit, 2L * times.length));
        }
        times[count++] = now;
        next = count % limit;
      } else {
        times[next] = now;
        next = (next + 1) % limit;
      }
    }

    long latest() {
      return count < limit ? times[count - 1] : times[(next - 1 + limit) % limit];
    }
  }
}
