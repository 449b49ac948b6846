package org.precedent.api.models;

import jakarta.validation.Valid;
import java.io.IOException;
import java.security.Principal;
import java.sql.Timestamp;
import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.precedent.api.system.AuditColumns;
import org.precedent.api.system.InForceHolder;
import org.precedent.api.system.ReplicaSync;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.transaction.support.TransactionTemplate;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RestController;
import org.springframework.web.server.ResponseStatusException;

/**
 * Model versions: list them, switch to one, or go back to the one before. A switch takes effect
 * for the next request; requests already deciding finish on the model they started with.
 */
@RestController
class ModelsController {
  private final InForceHolder models;
  private final JdbcTemplate db;
  private final AuditColumns audit;
  private final ReplicaSync replicas;
  private final TransactionTemplate tx;

  ModelsController(InForceHolder models, JdbcTemplate db, AuditColumns audit,
      ReplicaSync replicas, TransactionTemplate tx) {
    this.models = models;
    this.db = db;
    this.audit = audit;
    this.replicas = replicas;
    this.tx = tx;
  }

  @GetMapping("/api/v1/models")
  Map<String, Object> list() throws IOException {
    Map<String, Object> out = new LinkedHashMap<>();
    out.put("active", models.version());
    out.put("versions", models.versions());
    out.put("activations", db.query("SELECT activated_by, activated_at, old_version, "
        + "new_version, reason FROM model_activation ORDER BY id DESC", (rs, n) -> Map.of(
            "activatedBy", rs.getString(1), "activatedAt", rs.getTimestamp(2).toInstant().toString(),
            "from", rs.getString(3), "to", rs.getString(4), "reason", rs.getString(5))));
    return out;
  }

  @PostMapping(path = "/api/v1/models/{version}/activation",
      consumes = MediaType.APPLICATION_JSON_VALUE)
  Map<String, Object> activate(@PathVariable("version") String version,
      @Valid @RequestBody ActivationRequest request, Principal who) throws IOException {
    checkReason(request);
    if (!models.versions().contains(version)) {
      throw new ResponseStatusException(HttpStatus.NOT_FOUND, "no model version '" + version
          + "'; versions: " + String.join(", ", models.versions()));
    }
    return switchTo(version, request.reason(), who.getName());
  }

  /** Goes back to the version in force before the last switch (else the one before by number). */
  @PostMapping(path = "/api/v1/models/rollback", consumes = MediaType.APPLICATION_JSON_VALUE)
  Map<String, Object> rollback(@Valid @RequestBody ActivationRequest request, Principal who)
      throws IOException {
    checkReason(request);
    String now = models.version();
    List<String> last = db.query("SELECT old_version FROM model_activation WHERE new_version = ? "
        + "ORDER BY id DESC FETCH FIRST 1 ROWS ONLY", (rs, n) -> rs.getString(1), now);
    String target = last.isEmpty() ? null : last.get(0);
    if (target == null || !models.versions().contains(target)) {
      List<String> versions = models.versions();
      int at = versions.indexOf(now);
      target = at > 0 ? versions.get(at - 1) : null;
    }
    if (target == null) {
      throw new ResponseStatusException(HttpStatus.CONFLICT,
          "no earlier model version than " + now + " to go back to");
    }
    return switchTo(target, request.reason(), who.getName());
  }

  private void checkReason(ActivationRequest request) {
    audit.check("reason", request.reason().strip(), "model_activation", "reason");
  }

  private Map<String, Object> switchTo(String version, String reason, String who)
      throws IOException {
    String before = models.activate(version);
    Instant at = Instant.now();
    // The audit record and the row every replica reads: both or neither.
    tx.executeWithoutResult(status -> {
      db.update("INSERT INTO model_activation (activated_by, activated_at, old_version, "
          + "new_version, reason) VALUES (?, ?, ?, ?, ?)", who, Timestamp.from(at), before,
          version, reason.strip());
      replicas.publishVersion(version);
    });
    Map<String, Object> out = new LinkedHashMap<>();
    out.put("previous", before);
    out.put("active", version);
    out.put("activatedBy", who);
    out.put("activatedAt", at.toString());
    return out;
  }
}
