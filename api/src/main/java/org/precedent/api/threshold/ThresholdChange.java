package org.precedent.api.threshold;

import jakarta.validation.constraints.DecimalMax;
import jakarta.validation.constraints.DecimalMin;
import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import java.util.Map;

/**
 * A manager's change of the thresholds.
 *
 * @param global      the confidence needed for an automatic reply, 0 to 1
 * @param perCategory thresholds for single categories (replacing all earlier ones); may be absent
 * @param reason      why: kept in the audit record
 */
record ThresholdChange(
    @NotNull(message = "must be given")
    @DecimalMin(value = "0", message = "must be at least {value}")
    @DecimalMax(value = "1", message = "must be at most {value}")
    Double global,
    Map<String, Double> perCategory,
    // Its length is checked against the audit column (AuditColumns).
    @NotBlank(message = "must say why the threshold changes (kept in the audit record)")
    String reason) {}
