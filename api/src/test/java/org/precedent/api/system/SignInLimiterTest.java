package org.precedent.api.system;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.util.Optional;
import java.util.concurrent.atomic.AtomicLong;
import org.junit.jupiter.api.Test;

/**
 * The sliding window of failed sign-ins, on a clock the test moves (no waiting): its limits, the
 * time it asks a client to wait, and the bound on what it remembers.
 */
class SignInLimiterTest {
  static final long SECOND = 1_000_000_000L;
  final AtomicLong now = new AtomicLong(1_000 * SECOND);
  final SignInLimiter limiter = new SignInLimiter(3, 2, Duration.ofSeconds(60), 100, now::get);

  @Test
  void anAddressIsRefusedAfterItsAllowanceUntilTheOldestFailureLeavesTheWindow() {
    limiter.failed("203.0.113.1", null);
    now.addAndGet(10 * SECOND);
    limiter.failed("203.0.113.1", null);
    assertEquals(Optional.empty(), limiter.refusal("203.0.113.1", null));
    now.addAndGet(5 * SECOND);
    Optional<SignInLimiter.Refusal> third = limiter.failed("203.0.113.1", null);
    // Three failures at 0 s, 10 s and 15 s: the first leaves the 60 s window at 60 s, 45 s on.
    assertEquals(45, third.orElseThrow().retryAfterSeconds());
    assertTrue(third.get().detail().contains("203.0.113.1"), third.get().detail());
    assertEquals(Optional.empty(), limiter.refusal("203.0.113.2", null));
    now.addAndGet(44 * SECOND);
    assertEquals(1, limiter.refusal("203.0.113.1", null).orElseThrow().retryAfterSeconds());
    now.addAndGet(SECOND);
    assertEquals(Optional.empty(), limiter.refusal("203.0.113.1", null));
    // One failure more is allowed now; then the window is full again until 10 s is old.
    assertEquals(10, limiter.failed("203.0.113.1", null).orElseThrow().retryAfterSeconds());
  }

  @Test
  void aNameIsRefusedAfterItsAllowanceFromEveryAddress() {
    limiter.failed("198.51.100.1", "manager");
    limiter.failed("198.51.100.2", "manager");
    Optional<SignInLimiter.Refusal> r = limiter.refusal("198.51.100.3", "manager");
    assertEquals(60, r.orElseThrow().retryAfterSeconds());
    assertTrue(r.get().detail().contains("user name"), r.get().detail());
    assertEquals(Optional.empty(), limiter.refusal("198.51.100.3", "agent"));
    assertEquals(Optional.empty(), limiter.refusal("198.51.100.3", null));
  }

  @Test
  void whatItRemembersStaysWithinItsBoundWhateverIsSent() {
    for (int i = 0; i < 10_000; i++) {
      limiter.failed("10.0." + (i / 250) + "." + (i % 250), "guess-" + i + "x".repeat(5_000));
      now.addAndGet(1_000_000L);
    }
    int[] tracked = limiter.tracked();
    assertEquals(100, tracked[0]);
    assertEquals(100, tracked[1]);
    // Once the window has passed, the next failure clears every stale entry.
    now.addAndGet(61 * SECOND);
    limiter.failed("10.1.1.1", "ana");
    assertEquals(1, limiter.tracked()[0]);
    assertEquals(1, limiter.tracked()[1]);
  }

  @Test
  void aLargeAllowanceCostsMemoryOnlyForTheFailuresThereWere() {
    // Were each entry sized by the allowance, 2,000 entries a table would need 32 GB.
    SignInLimiter lax = new SignInLimiter(1_000_000, 1_000_000, Duration.ofSeconds(60), 10_000,
        now::get);
    for (int i = 0; i < 2_000; i++) {
      lax.failed("10.2." + (i / 250) + "." + (i % 250), "name-" + i);
    }
    assertEquals(2_000, lax.tracked()[1]);
    for (int i = 0; i < 1_000; i++) {
      lax.failed("10.3.0.1", "ana");
    }
    assertEquals(Optional.empty(), lax.refusal("10.3.0.1", "ana"));
  }

  @Test
  void anIpv6ClientIsCountedByItsSlash64Network() {
    for (int i = 1; i <= 3; i++) {
      limiter.failed("2001:db8:1:2:0:0:0:" + i, null);
    }
    assertTrue(limiter.refusal("2001:db8:1:2:ffff:0:0:9", null).isPresent());
    assertEquals(Optional.empty(), limiter.refusal("2001:db8:1:3:0:0:0:1", null));
    assertEquals("20010db800010002::/64", SignInLimiter.addressKey("2001:db8:1:2::7"));
    assertEquals("not-an-address", SignInLimiter.addressKey("not-an-address"));
  }
}
