package org.precedent.api.models;

import jakarta.validation.constraints.NotBlank;

/**
 * @param reason       why the model changes: kept in the audit record (its length is checked
 *                     against the audit column, by AuditColumns)
 * @param acknowledged the caller activates the version although its comparison with the version
 *                     in force says it is worse, or there is no comparison that still holds
 *                     (absent: false)
 */
record ActivationRequest(
    @NotBlank(message = "must say why the model changes (kept in the audit record)")
    String reason,
    Boolean acknowledged) {
  boolean acknowledges() {
    return Boolean.TRUE.equals(acknowledged);
  }
}
