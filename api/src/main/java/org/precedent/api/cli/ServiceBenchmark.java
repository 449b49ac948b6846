package org.precedent.api.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.precedent.demo.DemoTicket;
import org.precedent.demo.DemoTicketGenerator;
import org.precedent.api.system.PrecedentServer;
import org.springframework.context.ConfigurableApplicationContext;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

@Command(name = "service", mixinStandardHelpOptions = true,
    description = {"Measures the service's decision throughput and latency under load.",
        "It starts the service on the data directory's active model (loopback, a free port), or "
            + "uses the one at --url, and drives N concurrent clients against the decision "
            + "endpoint for a bounded time, then reports throughput, latency p50/p99, and "
            + "refusals (503/429: the service was busy and said when to come back; a client waits "
            + "that long, as a caller should) apart from errors. Questions are generated "
            + "demo-style tickets. On a service it starts, it then times failed sign-ins for a "
            + "known and an unknown user name."})
final class ServiceBenchmark implements Callable<Integer> {
  private static final String KEY = "bench-agent-key";
  /** Longest a client waits on a Retry-After, so a bad header cannot stall the run. */
  private static final long MOST_BACKOFF_MS = 10_000;

  @ParentCommand
  BenchmarkCommand benchmark;

  @Spec
  CommandSpec spec;

  @Option(names = "--clients", paramLabel = "N", defaultValue = "4",
      description = "Concurrent clients (default ${DEFAULT-VALUE}).")
  int clients;

  @Option(names = "--seconds", paramLabel = "S", defaultValue = "30",
      description = "How long to drive load, after a 5 s warm-up (default ${DEFAULT-VALUE}).")
  int seconds;

  @Option(names = "--guessers", paramLabel = "N", defaultValue = "0",
      description = "Clients guessing passwords (each from its own loopback address) during the "
          + "measured load, on a service started here (default ${DEFAULT-VALUE}).")
  int guessers;

  @Option(names = "--url", paramLabel = "URL",
      description = "A running service to drive (such as http://127.0.0.1:8080) instead of one "
          + "started here; its process can then be measured on its own.")
  URI url;

  @Option(names = "--key", paramLabel = "KEY", defaultValue = "demo-agent-key",
      description = "API key of an agent on the service at --url (default ${DEFAULT-VALUE}).")
  String key;

  @Option(names = "--runs", paramLabel = "N", defaultValue = "1",
      description = "Measured runs one after another, each of --seconds (default "
          + "${DEFAULT-VALUE}); with --pid, or on a service started here, the service's resident "
          + "memory is shown before the first and after each, so growth under load shows.")
  int runs;

  @Option(names = "--pid", paramLabel = "PID",
      description = "Process id of the service at --url, whose resident memory to show (Linux).")
  Long pid;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    if (clients < 1 || seconds < 1 || runs < 1) {
      throw new picocli.CommandLine.ParameterException(spec.commandLine(),
          "--clients, --seconds and --runs must be at least 1");
    }
    if (pid != null && url == null) {
      throw new picocli.CommandLine.ParameterException(spec.commandLine(),
          "--pid names the process of the service at --url; without --url the service runs here");
    }
    if (url != null && guessers > 0) {
      throw new picocli.CommandLine.ParameterException(spec.commandLine(),
          "--guessers needs a service started here, not one at --url");
    }
    ConfigurableApplicationContext context = null;
    SignInBenchmark signIn = null;
    URI base = url;
    String apiKey = key;
    if (base == null) {
      // The data directory of --data: one with a trained model, such as the demo's.
      Path data = benchmark.parent.dataDir();
      NumericLibrary.announce(spec.commandLine().getErr());
      List<String> settings = new ArrayList<>(List.of("--precedent.security.keys=bench:" + KEY
          + ":agent"));
      settings.addAll(SignInBenchmark.settings(java.util.UUID.randomUUID().toString()));
      context = PrecedentServer.start(data, 0, settings);
      base = URI.create("http://127.0.0.1:" + PrecedentServer.port(context));
      apiKey = KEY;
      signIn = new SignInBenchmark(PrecedentServer.port(context));
    }
    try {
      URI uri = base.resolve("/api/v1/decisions");
      ObjectMapper json = new ObjectMapper();
      List<String> bodies = new ArrayList<>();
      for (DemoTicket t : DemoTicketGenerator.generate(500, 99L)) {
        bodies.add(json.writeValueAsString(Map.of("question", t.subject() + "\n" + t.body())));
      }
      HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).build();
      drive(http, uri, apiKey, bodies, 5);
      // A service started here shares this process with the clients: its figure includes them.
      long service = pid != null ? pid : url == null ? ProcessHandle.current().pid() : -1;
      out.printf(Locale.ROOT, "machine: %d cores; %d clients for %d s over loopback%s%n",
          Runtime.getRuntime().availableProcessors(), clients, seconds,
          runs > 1 ? ", " + runs + " runs" : "");
      Resident.print(out, service, "after the warm-up");
      long errors = 0;
      for (int run = 1; run <= runs; run++) {
        errors += measure(out, http, uri, apiKey, bodies, signIn, run);
        Resident.print(out, service, "after run " + run);
      }
      if (signIn != null) {
        signIn.failureLatency(out, 100);
      }
      return errors == 0 ? 0 : PrecedentCommand.FAILED;
    } finally {
      if (context != null) {
        context.close();
      }
    }
  }

  /** One measured run; prints its figures and returns its count of errors. */
  private long measure(PrintWriter out, HttpClient http, URI uri, String apiKey,
    List<String> bodies, SignInBenchmark signIn, int run) throws Exception {
    SignInBenchmark.Guessing guessing = signIn == null ? null : signIn.guess(guessers,
        System.nanoTime() + seconds * 1_000_000_000L);
    Tally r = drive(http, uri, apiKey, bodies, seconds);
    long[] ok = sorted(r.ok());
    long[] refused = sorted(r.refused());
    long answered = ok.length + refused.length + r.errors();
    if (runs > 1) {
      out.printf(Locale.ROOT, "run %d:%n", run);
    }
    out.printf(Locale.ROOT, "decisions: %,d ok, %.1f per second; p50 %.1f ms, p99 %.1f ms, "
            + "max %.1f ms%n", ok.length, ok.length / (double) seconds,
        percentile(ok, 0.50) / 1e6, percentile(ok, 0.99) / 1e6,
        ok.length == 0 ? 0 : ok[ok.length - 1] / 1e6);
    out.printf(Locale.ROOT, "refused as busy (503/429): %,d, %.1f%% of requests; p50 %.1f ms, "
            + "p99 %.1f ms to the refusal%n", refused.length,
        answered == 0 ? 0 : 100.0 * refused.length / answered, percentile(refused, 0.50) / 1e6,
        percentile(refused, 0.99) / 1e6);
    out.printf(Locale.ROOT, "errors: %,d (other statuses, time-outs, broken connections)%n",
        r.errors());
    if (guessing != null) {
      guessing.report(out);
    }
    return r.errors();
  }

  /** What the clients saw: times of decisions, times of refusals, and the count of errors. */
  private record Tally(List<Long> ok, List<Long> refused, long errors) {}

  /** Each client sends one request after another until the time is up; the loop is bounded. */
  private Tally drive(HttpClient http, URI uri, String apiKey, List<String> bodies,
      int forSeconds) throws Exception {
    long end = System.nanoTime() + forSeconds * 1_000_000_000L;
    ExecutorService pool = Executors.newFixedThreadPool(clients);
    List<Future<Tally>> futures = new ArrayList<>();
    for (int c = 0; c < clients; c++) {
      int client = c;
      futures.add(pool.submit(() -> {
        List<Long> ok = new ArrayList<>();
        List<Long> refused = new ArrayList<>();
        long errors = 0;
        for (int i = client; System.nanoTime() < end && i < 1_000_000; i += clients) {
          HttpRequest request = HttpRequest.newBuilder(uri).timeout(Duration.ofSeconds(30))
              .header("Content-Type", "application/json").header("X-Precedent-Key", apiKey)
              .POST(HttpRequest.BodyPublishers.ofString(bodies.get(i % bodies.size()))).build();
          long t0 = System.nanoTime();
          try {
            HttpResponse<String> response = http.send(request, HttpResponse.BodyHandlers.ofString());
            long took = System.nanoTime() - t0;
            if (response.statusCode() == 200) {
              ok.add(took);
            } else if (response.statusCode() == 503 || response.statusCode() == 429) {
              refused.add(took);
              backOff(response, end);
            } else {
              errors++;
            }
          } catch (java.io.IOException e) {
            errors++;
          }
        }
        return new Tally(ok, refused, errors);
      }));
    }
    List<Long> ok = new ArrayList<>();
    List<Long> refused = new ArrayList<>();
    long errors = 0;
    for (Future<Tally> f : futures) {
      Tally t = f.get();
      ok.addAll(t.ok());
      refused.addAll(t.refused());
      errors += t.errors();
    }
    pool.shutdown();
    return new Tally(ok, refused, errors);
  }

  /** Waits as long as Retry-After says (whole seconds), but not past the end of the run. */
  private static void backOff(HttpResponse<String> response, long end)
      throws InterruptedException {
    long ms = response.headers().firstValue("Retry-After").map(v -> {
      try {
        return Long.parseLong(v.strip()) * 1000;
      } catch (NumberFormatException e) {
        return 1000L;
      }
    }).orElse(1000L);
    long left = (end - System.nanoTime()) / 1_000_000;
    Thread.sleep(Math.max(0, Math.min(Math.min(ms, MOST_BACKOFF_MS), left)));
  }

  private static long[] sorted(List<Long> nanos) {
    long[] a = nanos.stream().mapToLong(Long::longValue).toArray();
    Arrays.sort(a);
    return a;
  }

  private static long percentile(long[] sorted, double p) {
    return sorted.length == 0 ? 0 : RetrievalBenchmark.percentile(sorted, p);
  }
}
