package org.precedent.api.threshold;

import jakarta.validation.Valid;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.Principal;
import java.sql.Timestamp;
import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.precedent.api.answers.AnswerGate;
import org.precedent.api.answers.AnswerLibrary;
import org.precedent.api.answers.ApprovalCoverage;
import org.precedent.api.system.AuditColumns;
import org.precedent.api.system.FieldProblem;
import org.precedent.api.system.Limits;
import org.precedent.api.system.ReplicaSync;
import org.precedent.api.system.InForceHolder;
import org.precedent.engine.decide.Thresholds;
import org.precedent.engine.evaluate.EvaluationReport;
import org.precedent.engine.evaluate.ReportFiles;
import org.precedent.engine.measure.ThresholdDecimals;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.transaction.support.TransactionTemplate;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PutMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;
import org.springframework.web.server.ResponseStatusException;

/** The reply threshold: read it, change it (audited), and read the evaluation to choose it by. */
@RestController
class ThresholdController {
  private final InForceHolder models;
  private final JdbcTemplate db;
  private final AuditColumns audit;
  private final ReplicaSync replicas;
  private final TransactionTemplate tx;
  private final AnswerLibrary library;
  private final AnswerGate gate;

  ThresholdController(InForceHolder models, JdbcTemplate db, AuditColumns audit,
      ReplicaSync replicas, TransactionTemplate tx, AnswerLibrary library, AnswerGate gate) {
    this.library = library;
    this.gate = gate;
    this.models = models;
    this.db = db;
    this.audit = audit;
    this.replicas = replicas;
    this.tx = tx;
  }

  @GetMapping("/api/v1/threshold")
  Map<String, Object> current() {
    Thresholds t = models.thresholds();
    Map<String, Object> out = new LinkedHashMap<>();
    out.put("global", t.global());
    out.put("perCategory", new TreeMap<>(t.perCategory()));
    out.put("modelVersion", models.version());
    return out;
  }

  /**
   * Puts new thresholds in force for every later decision, writes them to the data directory and
   * keeps an audit record (who, when, old and new values, why); all of it or none.
   */
  @PutMapping(path = "/api/v1/threshold", consumes = MediaType.APPLICATION_JSON_VALUE)
  Map<String, Object> change(@Valid @RequestBody ThresholdChange change, Principal who)
      throws IOException {
    Map<String, Double> perCategory = change.perCategory() == null ? Map.of()
        : change.perCategory();
    perCategory.forEach((category, value) -> {
      if (category.length() > Limits.NAME_CHARS) {
        throw new FieldProblem("perCategory", "category '" + category.substring(0, 40)
            + "...' is longer than " + Limits.NAME_CHARS + " characters");
      }
      Thresholds.categoryProblem(category).ifPresent(problem -> {
        throw new FieldProblem("perCategory", "category '" + category + "' " + problem);
      });
      if (value == null || !(value >= 0 && value <= 1)) {
        throw new FieldProblem("perCategory." + category, "must be between 0 and 1");
      }
    });
    String reason = change.reason().strip();
    audit.check("reason", reason, "threshold_change", "reason");
    Thresholds next;
    try {
      next = new Thresholds(change.global(), perCategory);
    } catch (IllegalArgumentException e) {
      // Two names for one category ("Billing" and "billing").
      throw new FieldProblem("perCategory", e.getMessage());
    }
    int width = audit.width("threshold_change", "new_value");
    String described = ThresholdAudit.describe(next);
    if (described.length() > width) {
      throw new FieldProblem("perCategory", "these thresholds take " + described.length()
          + " characters in the audit record, which keeps at most " + width
          + ": set fewer categories, or shorter names");
    }
    Instant at = Instant.now();
    // The audit record and the row every replica reads: both or neither.
    Thresholds old = models.changeThresholds(next, (before, after) -> {
      Long revision = tx.execute(status -> {
        db.update("INSERT INTO threshold_change (changed_by, changed_at, old_value, "
            + "new_value, reason) VALUES (?, ?, ?, ?, ?)", who.getName(), Timestamp.from(at),
            // Set outside the service (evaluate --apply, by hand), the old ones may be longer.
            ThresholdAudit.abbreviate(ThresholdAudit.describe(before),
                audit.width("threshold_change", "old_value")),
            ThresholdAudit.describe(after), reason);
        return replicas.publishThresholds(after);
      });
      replicas.thresholdsCommitted(revision == null ? 0 : revision);
    });
    Map<String, Object> out = new LinkedHashMap<>();
    out.put("changedBy", who.getName());
    out.put("changedAt", at.toString());
    out.put("old", ThresholdAudit.describe(old));
    out.put("new", ThresholdAudit.describe(next));
    return out;
  }

  @GetMapping("/api/v1/threshold/changes")
  List<Map<String, Object>> changes() {
    return db.query("SELECT changed_by, changed_at, old_value, new_value, reason "
        + "FROM threshold_change ORDER BY id DESC", (rs, n) -> {
          Map<String, Object> m = new LinkedHashMap<>();
          m.put("changedBy", rs.getString(1));
          m.put("changedAt", rs.getTimestamp(2).toInstant().toString());
          m.put("old", rs.getString(3));
          m.put("new", rs.getString(4));
          m.put("reason", rs.getString(5));
          return m;
        });
  }

  /**
   * The latest evaluation at {@code threshold} (default: the global threshold in force) with and
   * without the approval gate, from the library as it is now, and what approving each drafted
   * answer would add.
   */
  @GetMapping("/api/v1/threshold/approval")
  ApprovalCoverage.Report approval(
      @RequestParam(name = "threshold", required = false) Double threshold) throws IOException {
    if (threshold != null && !(threshold >= 0 && threshold <= 1)) {
      throw new FieldProblem("threshold", "must be between 0 and 1");
    }
    EvaluationReport report = evaluation();
    if (report.outcomes().isEmpty()) {
      throw new ResponseStatusException(HttpStatus.NOT_FOUND, "the latest evaluation was made "
          + "before each held-out ticket's answer was kept: run 'precedent evaluate' again");
    }
    library.syncIfNew(models.dataDir());
    return ApprovalCoverage.of(report.outcomes(),
        threshold != null ? threshold : models.thresholds().global(), library.list(null, null),
        gate.approvalRequired());
  }

  /** The latest evaluation report ({@code precedent evaluate}), to choose a threshold by. */
  @GetMapping("/api/v1/threshold/evaluation")
  EvaluationReport evaluation() throws IOException {
    Path latest = models.dataDir().latestReport();
    if (!Files.isRegularFile(latest)) {
      throw new ResponseStatusException(HttpStatus.NOT_FOUND,
          "no evaluation yet: run 'precedent evaluate' on held-out tickets first");
    }
    return ReportFiles.readJson(latest);
  }

}
