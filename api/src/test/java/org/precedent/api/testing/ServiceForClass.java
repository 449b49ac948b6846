package org.precedent.api.testing;

import java.nio.file.Path;
import org.junit.jupiter.api.extension.AfterAllCallback;
import org.junit.jupiter.api.extension.BeforeAllCallback;
import org.junit.jupiter.api.extension.ExtensionContext;

/**
 * One real service for all the tests of a class, started before the first and closed after the
 * last: {@code @RegisterExtension static final ServiceForClass service = new ServiceForClass();}.
 */
public final class ServiceForClass implements BeforeAllCallback, AfterAllCallback {
  private final String[] settings;
  private RunningService running;

  /** @param settings further settings of the service, as {@code --name=value} */
  public ServiceForClass(String... settings) {
    this.settings = settings.clone();
  }

  @Override
  public void beforeAll(ExtensionContext context) {
    running = RunningService.start(settings);
  }

  @Override
  public void afterAll(ExtensionContext context) {
    if (running != null) {
      running.close();
      running = null;
    }
  }

  public Http http() {
    return running().http();
  }

  public Path data() {
    return running().data();
  }

  public <T> T bean(Class<T> type) {
    return running().bean(type);
  }

  private RunningService running() {
    if (running == null) {
      throw new IllegalStateException("the service runs only while the test class does");
    }
    return running;
  }
}
