package org.precedent.api.threshold;

import java.io.IOException;
import org.precedent.api.system.InForceHolder;
import org.springframework.context.ApplicationContext;

/**
 * A change of the global threshold made in the process that runs the service (the demo, once
 * its second version is in force), through the service's own endpoint method: validated,
 * audited and in force for the next request, as {@code PUT /api/v1/threshold} is. The
 * per-category thresholds in force stay. {@link ThresholdAudit#applyFromCommandLine} cannot
 * serve here: the running service holds the database.
 */
public final class ServiceThresholds {
  private ServiceThresholds() {}

  public static void setGlobal(ApplicationContext context, double global, String who,
      String reason) throws IOException {
    InForceHolder models = context.getBean(InForceHolder.class);
    context.getBean(ThresholdController.class).change(new ThresholdChange(global,
        models.thresholds().perCategory(), reason), () -> who);
  }
}
