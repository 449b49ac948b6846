package org.precedent.api.cli;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.PrintWriter;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.net.Socket;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Base64;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;

/**
 * Failed sign-ins against the running service, each from its own loopback address (Linux routes
 * all of 127.0.0.0/8 to the loopback interface), so that the service sees distinct clients: how long
 * a failure takes for a known and for an unknown user name, and guessing clients that run beside
 * the measured load.
 */
final class SignInBenchmark {
  /** The one configured user; the benchmark never presents its password. */
  static final String USER = "bench-user";

  private final int port;
  private final AtomicInteger nextAddress = new AtomicInteger();

  SignInBenchmark(int port) {
    this.port = port;
  }

  /** Settings that add the benchmark's user and let every failure reach the password check. */
  static List<String> settings(String password) {
    return List.of("--precedent.security.users=" + USER + ":" + password + ":agent",
        "--precedent.security.failed-sign-ins.per-name=1000000");
  }

  /** Times {@code each} failures for the known name and as many for unknown ones. */
  void failureLatency(PrintWriter out, int each) throws IOException {
    long[] known = new long[each];
    long[] unknown = new long[each];
    for (int i = 0; i < each; i++) {
      // Taking turns at going first, so that neither kind always follows the other.
      if (i % 2 == 0) {
        known[i] = timed(USER, "wrong-" + i);
        unknown[i] = timed("nobody-" + i, "wrong-" + i);
      } else {
        unknown[i] = timed("nobody-" + i, "wrong-" + i);
        known[i] = timed(USER, "wrong-" + i);
      }
    }
    Arrays.sort(known);
    Arrays.sort(unknown);
    out.printf(Locale.ROOT, "failed sign-in (HTTP basic, new connection each): known name p50 "
            + "%.1f ms, p90 %.1f ms; unknown name p50 %.1f ms, p90 %.1f ms (%d each)%n",
        ms(known, 0.5), ms(known, 0.9), ms(unknown, 0.5), ms(unknown, 0.9), each);
  }

  /** Starts {@code n} clients that guess passwords for unknown names until {@code end}. */
  Guessing guess(int n, long end) {
    ExecutorService pool = Executors.newFixedThreadPool(Math.max(1, n));
    List<Future<Map<Integer, Integer>>> futures = new ArrayList<>();
    for (int g = 0; g < n; g++) {
      InetAddress from = address();
      futures.add(pool.submit(() -> {
        Map<Integer, Integer> statuses = new TreeMap<>();
        for (int i = 0; System.nanoTime() < end && i < 1_000_000; i++) {
          int status = attempt(from, basic("guess-" + i, "guess-" + i));
          statuses.merge(status, 1, Integer::sum);
        }
        return statuses;
      }));
    }
    pool.shutdown();
    return new Guessing(futures);
  }

  /** Guessing clients at work; {@link #report} waits for them. */
  static final class Guessing {
    private final List<Future<Map<Integer, Integer>>> futures;

    private Guessing(List<Future<Map<Integer, Integer>>> futures) {
      this.futures = futures;
    }

    void report(PrintWriter out) throws Exception {
      if (futures.isEmpty()) {
        return;
      }
      Map<Integer, Integer> all = new TreeMap<>();
      for (Future<Map<Integer, Integer>> f : futures) {
        f.get().forEach((status, count) -> all.merge(status, count, Integer::sum));
      }
      out.printf(Locale.ROOT, "guessing clients (%d, each from its own address): answers by "
          + "status %s%n", futures.size(), all);
    }
  }

  private long timed(String user, String password) throws IOException {
    long t0 = System.nanoTime();
    int status = attempt(address(), basic(user, password));
    long took = System.nanoTime() - t0;
    if (status != 401) {
      throw new IOException("a failed sign-in was answered " + status + ", not 401");
    }
    return took;
  }

  /** A fresh loopback address for each client: 127.1.x.y. */
  private InetAddress address() {
    int n = nextAddress.getAndIncrement();
    try {
      return InetAddress.getByAddress(new byte[] {127, 1, (byte) (n / 250), (byte) (1 + n % 250)});
    } catch (java.net.UnknownHostException e) {
      throw new IllegalStateException(e);
    }
  }

  private static String basic(String user, String password) {
    return "Basic " + Base64.getEncoder().encodeToString((user + ":" + password)
        .getBytes(StandardCharsets.UTF_8));
  }

  /** One HTTP/1.1 request on a new connection from {@code from}; returns the status (0: failed). */
  private int attempt(InetAddress from, String authorization) {
    try (Socket socket = new Socket()) {
      socket.bind(new InetSocketAddress(from, 0));
      socket.connect(new InetSocketAddress(InetAddress.getLoopbackAddress(), port), 5_000);
      socket.setSoTimeout(30_000);
      OutputStream out = socket.getOutputStream();
      out.write(("GET /api/v1/threshold HTTP/1.1\r\nHost: 127.0.0.1\r\nAuthorization: "
          + authorization + "\r\nX-Requested-With: XMLHttpRequest\r\nConnection: close\r\n\r\n")
          .getBytes(StandardCharsets.US_ASCII));
      out.flush();
      InputStream in = socket.getInputStream();
      byte[] head = new byte[12];
      int read = 0;
      while (read < head.length) {
        int n = in.read(head, read, head.length - read);
        if (n < 0) {
          return 0;
        }
        read += n;
      }
      byte[] rest = new byte[4096];
      while (in.read(rest) >= 0) {
        // the rest of the answer, until the service closes the connection
      }
      return Integer.parseInt(new String(head, 9, 3, StandardCharsets.US_ASCII));
    } catch (IOException | NumberFormatException e) {
      return 0;
    }
  }

  private static double ms(long[] sorted, double p) {
    return RetrievalBenchmark.percentile(sorted, p) / 1e6;
  }
}
