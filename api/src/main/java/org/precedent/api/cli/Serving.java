package org.precedent.api.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import org.precedent.api.system.InForceHolder;
import org.precedent.api.system.PrecedentServer;
import org.precedent.api.system.ServiceStartException;
import org.springframework.context.ConfigurableApplicationContext;
import org.springframework.context.event.ContextClosedEvent;

/** The service run in the foreground, as {@code serve} and the demo's last step start it. */
final class Serving {
  private Serving() {}

  /** Starts the service on a data directory with a trained model; returns when it is stopped. */
  static int run(PrintWriter out, PrintWriter err, Path data, int port, List<String> settings)
      throws InterruptedException, IOException {
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
