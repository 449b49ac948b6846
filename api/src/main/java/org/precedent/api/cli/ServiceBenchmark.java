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
import java.util.concurrent.atomic.AtomicLong;
import org.precedent.api.demo.DemoTicket;
import org.precedent.api.demo.DemoTicketGenerator;
import org.precedent.api.system.PrecedentServer;
import org.springframework.context.ConfigurableApplicationContext;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

@Command(name = "service", mixinStandardHelpOptions = true,
    description = {"Measures the service's decision throughput and latency under load.",
        "It starts the service on the data directory's active model (loopback, a free port) and "
            + "drives N concurrent clients against the decision endpoint for a bounded time, then "
            + "reports throughput, latency p50/p99 and errors. Questions are generated demo-style "
            + "tickets. Then it times failed sign-ins for a known and an unknown user name."})
final class ServiceBenchmark implements Callable<Integer> {
  private static final String KEY = "bench-agent-key";

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
          + "measured load (default ${DEFAULT-VALUE}).")
  int guessers;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    // The data directory of --data: one with a trained model, such as the demo's.
    Path data = benchmark.parent.dataDir();
    NumericLibrary.announce(spec.commandLine().getErr());
    List<String> settings = new ArrayList<>(List.of("--precedent.security.keys=bench:" + KEY
        + ":agent"));
    settings.addAll(SignInBenchmark.settings(java.util.UUID.randomUUID().toString()));
    ConfigurableApplicationContext context = PrecedentServer.start(data, 0, settings);
    try {
      SignInBenchmark signIn = new SignInBenchmark(PrecedentServer.port(context));
      URI uri = URI.create("http://127.0.0.1:" + PrecedentServer.port(context)
          + "/api/v1/decisions");
      ObjectMapper json = new ObjectMapper();
      List<String> bodies = new ArrayList<>();
      for (DemoTicket t : DemoTicketGenerator.generate(500, 99L)) {
        bodies.add(json.writeValueAsString(Map.of("question", t.subject() + "\n" + t.body())));
      }
      HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).build();
      drive(http, uri, bodies, 5);
      SignInBenchmark.Guessing guessing = signIn.guess(guessers,
          System.nanoTime() + seconds * 1_000_000_000L);
      Result r = drive(http, uri, bodies, seconds);
      long[] nanos = r.nanos();
      Arrays.sort(nanos);
      out.printf(Locale.ROOT, "machine: %d cores; %d clients for %d s over loopback%n",
          Runtime.getRuntime().availableProcessors(), clients, seconds);
      out.printf(Locale.ROOT, "decisions: %,d ok, %,d errors; %.1f per second; p50 %.1f ms, "
              + "p99 %.1f ms, max %.1f ms%n", nanos.length, r.errors(), nanos.length / (double) seconds,
          percentile(nanos, 0.50) / 1e6, percentile(nanos, 0.99) / 1e6,
          nanos.length == 0 ? 0 : nanos[nanos.length - 1] / 1e6);
      guessing.report(out);
      signIn.failureLatency(out, 100);
      return r.errors() == 0 ? 0 : PrecedentCommand.FAILED;
    } finally {
      context.close();
    }
  }

  private record Result(long[] nanos, long errors) {}

  /** Each client sends one request after another until the time is up; the loop is bounded. */
  private Result drive(HttpClient http, URI uri, List<String> bodies, int forSeconds)
      throws Exception {
    long end = System.nanoTime() + forSeconds * 1_000_000_000L;
    AtomicLong errors = new AtomicLong();
    ExecutorService pool = Executors.newFixedThreadPool(clients);
    List<Future<List<Long>>> futures = new ArrayList<>();
    for (int c = 0; c < clients; c++) {
      int client = c;
      futures.add(pool.submit(() -> {
        List<Long> times = new ArrayList<>();
        for (int i = client; System.nanoTime() < end && i < 1_000_000; i += clients) {
          HttpRequest request = HttpRequest.newBuilder(uri).timeout(Duration.ofSeconds(30))
              .header("Content-Type", "application/json").header("X-Precedent-Key", KEY)
              .POST(HttpRequest.BodyPublishers.ofString(bodies.get(i % bodies.size()))).build();
          long t0 = System.nanoTime();
          try {
            HttpResponse<String> response = http.send(request, HttpResponse.BodyHandlers.ofString());
            if (response.statusCode() == 200) {
              times.add(System.nanoTime() - t0);
            } else {
              errors.incrementAndGet();
            }
          } catch (java.io.IOException e) {
            errors.incrementAndGet();
          }
        }
        return times;
      }));
    }
    List<Long> all = new ArrayList<>();
    for (Future<List<Long>> f : futures) {
      all.addAll(f.get());
    }
    pool.shutdown();
    return new Result(all.stream().mapToLong(Long::longValue).toArray(), errors.get());
  }

  private static long percentile(long[] sorted, double p) {
    return sorted.length == 0 ? 0 : RetrievalBenchmark.percentile(sorted, p);
  }
}
