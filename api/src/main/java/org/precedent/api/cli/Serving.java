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
    ConfigurableApplicationContext context = start(out, err, data, port, settings);
    if (context == null) {
      return PrecedentCommand.FAILED;
    }
    out.println("Stop it with Ctrl-C.");
    out.flush();
    awaitClosed(context);
    return 0;
  }

  /**
   * Starts the service and says where it serves; null (the reason printed) when it cannot start.
   */
  static ConfigurableApplicationContext start(PrintWriter out, PrintWriter err, Path data,
      int port, List<String> settings) throws IOException {
    ConfigurableApplicationContext context;
    NumericLibrary.announce(err);
    try {
      context = PrecedentServer.start(data, port, settings);
    } catch (ServiceStartException e) {
      err.println("precedent serve: " + e.getMessage());
      return null;
    } catch (RuntimeException e) {
      err.println("precedent serve: " + Messages.oneLine(rootCause(e)));
      return null;
    }
    String version = context.getBean(InForceHolder.class).version();
    out.printf("Precedent is serving model %s from %s at %s%n", version,
        data.toAbsolutePath(), PrecedentServer.url(context));
    out.flush();
    return context;
  }

  /** Waits until the service stops (Ctrl-C closes its context). */
  static void awaitClosed(ConfigurableApplicationContext context) throws InterruptedException {
    CountDownLatch closed = new CountDownLatch(1);
    context.addApplicationListener(e -> {
      if (e instanceof ContextClosedEvent) {
        closed.countDown();
      }
    });
    if (!context.isActive()) {
      return;
    }
    closed.await();
  }

  private static Throwable rootCause(Throwable e) {
    Throwable t = e;
    while (t.getCause() != null && t.getCause() != t) {
      t = t.getCause();
    }
    return t;
  }
}
