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
import org.precedent.engine.evaluate.VersionComparisons;
import org.springframework.http.HttpStatus;
import org.springframework.http.ProblemDetail;
import org.springframework.web.ErrorResponseException;
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
  private static final com.fasterxml.jackson.databind.ObjectMapper JSON =
      new com.fasterxml.jackson.databind.ObjectMapper();
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
        + "new_version, reason, comparison, acknowledged FROM model_activation ORDER BY id DESC",
        (rs, n) -> {
          Map<String, Object> row = new LinkedHashMap<>();
          row.put("activatedBy", rs.getString(1));
          row.put("activatedAt", rs.getTimestamp(2).toInstant().toString());
          row.put("from", rs.getString(3));
          row.put("to", rs.getString(4));
          row.put("reason", rs.getString(5));
          row.put("comparison", comparisonJson(rs.getString(6)));
          row.put("acknowledged", rs.getBoolean(7));
          return row;
        }));
    return out;
  }

  /**
   * What activating {@code version} would show: its comparison with the version in force, and
   * why it would need an acknowledgement, if it would.
   */
  @GetMapping("/api/v1/models/{version}/comparison")
  Map<String, Object> comparison(@PathVariable("version") String version) throws IOException {
    known(version);
    return view(Activations.judge(models.dataDir(), models.version(), version));
  }

  @PostMapping(path = "/api/v1/models/{version}/activation",
      consumes = MediaType.APPLICATION_JSON_VALUE)
  Map<String, Object> activate(@PathVariable("version") String version,
      @Valid @RequestBody ActivationRequest request, Principal who) throws IOException {
    checkReason(request);
    known(version);
    Activations.Verdict verdict = Activations.judge(models.dataDir(), models.version(), version);
    if (verdict.needsAcknowledgement() && !request.acknowledges()) {
      ProblemDetail p = ProblemDetail.forStatusAndDetail(HttpStatus.CONFLICT, "not activated: "
          + verdict.objection() + ". To activate it all the same, send \"acknowledged\": true "
          + "with the reason; the model in force is unchanged");
      p.setTitle("Activation needs an acknowledgement");
      p.setProperty("candidate", verdict.candidate());
      p.setProperty("inForce", verdict.inForce());
      p.setProperty("comparison", verdict.comparison());
      throw new ErrorResponseException(HttpStatus.CONFLICT, p, null);
    }
    Map<String, Object> out = switchTo(version, request.reason(), who.getName(),
        verdict.comparison() == null ? null : VersionComparisons.compact(verdict.comparison()),
        verdict.needsAcknowledgement());
    out.put("comparison", verdict.comparison());
    out.put("acknowledged", verdict.needsAcknowledgement());
    return out;
  }

  private void known(String version) throws IOException {
    if (!models.versions().contains(version)) {
      throw new ResponseStatusException(HttpStatus.NOT_FOUND, "no model version '" + version
          + "'; versions: " + String.join(", ", models.versions()));
    }
  }

  private static Map<String, Object> view(Activations.Verdict verdict) {
    Map<String, Object> out = new LinkedHashMap<>();
    out.put("candidate", verdict.candidate());
    out.put("inForce", verdict.inForce());
    out.put("comparison", verdict.comparison());
    out.put("needsAcknowledgement", verdict.needsAcknowledgement());
    out.put("objection", verdict.objection());
    return out;
  }

  /** The comparison an audit row kept, as JSON again (an unreadable one as its text). */
  private static Object comparisonJson(String kept) {
    if (kept == null) {
      return null;
    }
    try {
      return JSON.readTree(kept);
    } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
      return kept;
    }
  }

  /**
   * Goes back to the version in force before the last switch (else the one before by number).
   * No comparison is asked for: going back is how a bad activation is undone, and the version was
   * in force before; the audit row says there was none.
   */
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
    return switchTo(target, request.reason(), who.getName(), null, false);
  }

  private void checkReason(ActivationRequest request) {
    audit.check("reason", request.reason().strip(), "model_activation", "reason");
  }

  private Map<String, Object> switchTo(String version, String reason, String who,
      String comparison, boolean acknowledged) throws IOException {
    String before = models.activate(version);
    Instant at = Instant.now();
    // The audit record and the row every replica reads: both or neither.
    tx.executeWithoutResult(status -> {
      db.update(ModelAudit.INSERT, who, Timestamp.from(at), before, version, reason.strip(),
          comparison, acknowledged);
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
