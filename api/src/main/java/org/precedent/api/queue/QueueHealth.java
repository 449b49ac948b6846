package org.precedent.api.queue;

import org.springframework.boot.actuate.health.Health;
import org.springframework.boot.actuate.health.HealthIndicator;
import org.springframework.stereotype.Component;

/**
 * The {@code queue} part of {@code /actuator/health}: DOWN when the worker that decides queued
 * tickets is not running, since tickets would then be stored and never decided.
 */
@Component("queueHealthIndicator")
class QueueHealth implements HealthIndicator {
  private final QueueWorker worker;

  QueueHealth(QueueWorker worker) {
    this.worker = worker;
  }

  @Override
  public Health health() {
    return worker.alive() ? Health.up().build()
        : Health.down().withDetail("worker", "not running: queued tickets are not decided").build();
  }
}
