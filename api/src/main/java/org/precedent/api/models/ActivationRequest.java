package org.precedent.api.models;

import jakarta.validation.constraints.NotBlank;

/**
 * @param reason why the model changes: kept in the audit record (its length is checked against the
 *     audit column, by AuditColumns)
 */
record ActivationRequest(
    @NotBlank(message = "must say why the model changes (kept in the audit record)")
    String reason) {}
