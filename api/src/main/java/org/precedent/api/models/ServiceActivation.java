package org.precedent.api.models;

import java.io.IOException;
import java.util.Map;
import org.springframework.context.ApplicationContext;
import org.springframework.web.ErrorResponseException;

/**
 * An activation made in the process that runs the service (the demo's second stage), through the
 * service's own endpoint method, so that it is judged ({@link Activations#judge}: a worse or
 * uncompared version is refused without an acknowledgement, which this door never gives),
 * audited, published to replicas and put in force for the next request exactly as {@code POST
 * /api/v1/models/{version}/activation} does. {@link ModelAudit#activateFromCommandLine} cannot
 * serve here: the running service holds the database.
 */
public final class ServiceActivation {
  private ServiceActivation() {}

  /**
   * What came of it.
   *
   * @param activated whether the version is now in force
   * @param previous  the version in force before, when activated
   * @param objection why it was refused (the 409's detail), when not activated
   */
  public record Result(boolean activated, String previous, String objection) {}

  /** Asks the running service in {@code context} to put {@code version} in force. */
  public static Result activate(ApplicationContext context, String version, String who,
      String reason) throws IOException {
    ModelsController controller = context.getBean(ModelsController.class);
    try {
      Map<String, Object> out = controller.activate(version,
          new ActivationRequest(reason, false), () -> who);
      return new Result(true, (String) out.get("previous"), null);
    } catch (ErrorResponseException e) {
      if (e.getStatusCode().value() == 409) {
        return new Result(false, null, e.getBody().getDetail());
      }
      throw e;
    }
  }
}
