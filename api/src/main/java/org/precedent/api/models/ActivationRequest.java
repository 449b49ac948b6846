package org.precedent.api.models;

import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.Size;
import org.precedent.api.system.Limits;

/** @param reason why the model changes: kept in the audit record */
record ActivationRequest(
    @NotBlank(message = "must say why the model changes (kept in the audit record)")
    @Size(max = Limits.REASON_CHARS, message = "must be at most {max} characters")
    String reason) {}
