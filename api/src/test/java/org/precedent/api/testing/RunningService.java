package org.precedent.api.testing;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.List;
import org.precedent.api.system.PrecedentServer;
import org.springframework.context.ConfigurableApplicationContext;

/** The real service on a free port, over its own copy of the trained data directory. */
public final class RunningService implements AutoCloseable {
  private final Path data;
  private final ConfigurableApplicationContext context;
  private final Http http;
  private final boolean keep;

  private RunningService(Path data, ConfigurableApplicationContext context, boolean keep) {
    this.data = data;
    this.context = context;
    this.keep = keep;
    this.http = new Http(PrecedentServer.port(context));
  }

  public static RunningService start(String... settings) {
    return startOn(TrainedData.copy(), settings);
  }

  /** The service over {@code data}, a copy the caller prepared (it is deleted on close). */
  public static RunningService startOn(Path data, String... settings) {
    return start(data, false, settings);
  }

  /**
   * The service over {@code data}, which outlives it: for a test that reads what the service
   * stored once it stopped (the caller deletes the directory).
   */
  public static RunningService startKeeping(Path data, String... settings) {
    return start(data, true, settings);
  }

  private static RunningService start(Path data, boolean keep, String... settings) {
    try {
      return new RunningService(data, PrecedentServer.start(data, 0, List.of(settings)), keep);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  public Http http() {
    return http;
  }

  public Path data() {
    return data;
  }

  public <T> T bean(Class<T> type) {
    return context.getBean(type);
  }

  /** The service's application context: for code that acts inside the running service. */
  public org.springframework.context.ApplicationContext context() {
    return context;
  }

  @Override
  public void close() {
    context.close();
    if (!keep) {
      TrainedData.delete(data);
    }
  }
}
