package org.precedent.api.suggest;

import jakarta.validation.Valid;
import java.security.Principal;
import java.sql.Timestamp;
import java.time.Instant;
import java.util.Map;
import org.precedent.api.system.FieldProblem;
import org.precedent.api.system.InForceHolder;
import org.precedent.knowledge.clean.TextCleaner;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.jdbc.support.GeneratedKeyHolder;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.ResponseStatus;
import org.springframework.web.bind.annotation.RestController;

/** Records what agents did with suggestions: the raw material for the next training run. */
@RestController
class FeedbackController {
  private final JdbcTemplate db;
  private final InForceHolder models;
  private final TextCleaner cleaner = TextCleaner.standard();

  FeedbackController(JdbcTemplate db, InForceHolder models) {
    this.db = db;
    this.models = models;
  }

  @PostMapping(path = "/api/v1/feedback", consumes = MediaType.APPLICATION_JSON_VALUE)
  @ResponseStatus(HttpStatus.CREATED)
  Map<String, Object> record(@Valid @RequestBody FeedbackRequest f, Principal agent) {
    boolean edited = f.verdict() == FeedbackRequest.Verdict.EDITED;
    if (edited && (f.finalText() == null || f.finalText().isBlank())) {
      throw new FieldProblem("finalText", "required when the verdict is EDITED");
    }
    if (!edited && f.finalText() != null && !f.finalText().isBlank()) {
      throw new FieldProblem("finalText", "only an EDITED verdict carries a final text");
    }
    boolean propose = Boolean.TRUE.equals(f.propose());
    if (propose && !edited) {
      throw new FieldProblem("propose", "only an EDITED verdict proposes a new version");
    }
    Instant now = Instant.now();
    var keys = new GeneratedKeyHolder();
    // Both texts are redacted before they are kept: feedback is stored for as long as audits are.
    db.update(c -> {
      var s = c.prepareStatement("INSERT INTO suggestion_feedback (agent, recorded_at, ticket_id, "
          + "question, answer_group, verdict, final_text, model_version, suggested_text, "
          + "proposed) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?)", new String[] {"id"});
      s.setString(1, agent.getName());
      s.setTimestamp(2, Timestamp.from(now));
      s.setString(3, f.ticketId());
      s.setString(4, cleaner.cleanQuestion(f.question()));
      s.setString(5, f.answerGroup());
      s.setString(6, f.verdict().name());
      s.setString(7, edited ? cleaner.redact(f.finalText()) : null);
      s.setString(8, models.version());
      s.setString(9, f.suggestedText() == null || f.suggestedText().isBlank() ? null
          : cleaner.redact(f.suggestedText()));
      s.setBoolean(10, propose);
      return s;
    }, keys);
    return Map.of("id", keys.getKey().longValue(), "recordedAt", now.toString(),
        "verdict", f.verdict().name(), "proposed", propose);
  }
}
