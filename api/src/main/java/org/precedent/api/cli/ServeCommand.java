package org.precedent.api.cli;

import java.io.PrintWriter;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.concurrent.CountDownLatch;
import org.precedent.api.system.InForceHolder;
import org.precedent.api.system.PrecedentServer;
import org.precedent.api.system.ServiceStartException;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.knowledge.store.DataDir;
import org.springframework.context.ConfigurableApplicationContext;
import org.springframework.context.event.ContextClosedEvent;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(name = "serve", mixinStandardHelpOptions = true,
    description = {"Runs the HTTP service and its pages on the active model.",
        "It serves suggestions, decisions, the ticket queue, feedback, thresholds and model "
            + "versions as JSON under /api/v1, described in OpenAPI at /api/v1/openapi. Stop it "
            + "with Ctrl-C; queued tickets are kept.",
        "Further settings go after the options as --name=value; application.properties lists "
            + "them."})
final class ServeCommand implements Callable<Integer> {
  @ParentCommand
  PrecedentCommand parent;

  @Spec
  CommandSpec spec;

  @Option(names = "--port", paramLabel = "N", defaultValue = "8080",
      description = "Port to listen on (default ${DEFAULT-VALUE}; 0 picks a free one).")
  int port;

  @Parameters(paramLabel = "SETTING", arity = "0..*",
      description = "Service settings, like --precedent.security.users=... (after --).")
  List<String> settings;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    DataDir dataDir = new DataDir(parent.dataDir());
    // Said here in one line rather than as a failed start of the whole application.
    if (dataDir.currentGeneration().isEmpty()) {
      spec.commandLine().getErr().println("precedent serve: no tickets in " + dataDir.root()
          + " yet: run 'precedent ingest FILE' first (or 'precedent demo')");
      return PrecedentCommand.FAILED;
    }
    if (new ModelStore(dataDir.models()).activeVersion().isEmpty()) {
      spec.commandLine().getErr().println("precedent serve: no trained model in " + dataDir.root()
          + " yet: run 'precedent train' first");
      return PrecedentCommand.FAILED;
    }
    return serve(out, spec.commandLine().getErr(), parent.dataDir(), port,
        settings == null ? List.of() : settings);
  }

  /** Starts the service on a data directory with a trained model; returns when it is stopped. */
  static int serve(PrintWriter out, PrintWriter err, java.nio.file.Path data, int port,
      List<String> settings) throws InterruptedException, java.io.IOException {
    ConfigurableApplicationContext context;
    NumericLibrary.announce(err);
    try {
      context = PrecedentServer.start(data, port, settings);
    } catch (ServiceStartException e) {
      err.println("precedent serve: " + e.getMessage());
      return PrecedentCommand.FAILED;
    } catch (RuntimeException e) {
      err.println("precedent serve: " + Messages.oneLine(rootCause(e)));
      return PrecedentCommand.FAILED;
    }
    CountDownLatch closed = new CountDownLatch(1);
    context.addApplicationListener(e -> {
      if (e instanceof ContextClosedEvent) {
        closed.countDown();
      }
    });
    String version = context.getBean(InForceHolder.class).version();
    out.printf("Precedent is serving model %s from %s at %s%n", version,
        data.toAbsolutePath(), PrecedentServer.url(context));
    out.println("Stop it with Ctrl-C.");
    out.flush();
    closed.await();
    return 0;
  }

  private static Throwable rootCause(Throwable e) {
    Throwable t = e;
    while (t.getCause() != null && t.getCause() != t) {
      t = t.getCause();
    }
    return t;
  }
}
