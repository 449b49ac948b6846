package org.precedent.api.answers;

import jakarta.validation.Valid;
import java.io.IOException;
import java.security.Principal;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.precedent.api.answers.StoredAnswer.State;
import org.precedent.api.system.AuditColumns;
import org.precedent.api.system.FieldProblem;
import org.precedent.api.system.InForceHolder;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ProblemDetail;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.PutMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/** The answer library over HTTP: agents read it; managers edit, approve and retire, with a reason. */
@RestController
class AnswersController {
  private static final int AUDIT_SHOWN = 200;
  private static final int EDITS_SHOWN = 10;
  private final AnswerLibrary library;
  private final InForceHolder models;
  private final AuditColumns columns;
  private final AnswerGate gate;

  AnswersController(AnswerLibrary library, InForceHolder models, AuditColumns columns,
      AnswerGate gate) {
    this.library = library;
    this.models = models;
    this.columns = columns;
    this.gate = gate;
  }

  private void synced() throws IOException {
    library.syncIfNew(models.dataDir());
  }

  @GetMapping("/api/v1/answers")
  Map<String, Object> list(@RequestParam(name = "search", required = false) String search,
      @RequestParam(name = "state", required = false) String state) throws IOException {
    synced();
    State s = null;
    if (state != null && !state.isBlank()) {
      try {
        s = State.valueOf(state.strip().toUpperCase(Locale.ROOT));
      } catch (IllegalArgumentException e) {
        throw new FieldProblem("state", "must be drafted, approved or retired");
      }
    }
    if (search != null && search.length() > Titles.MAX_CHARS) {
      throw new FieldProblem("search", "must be at most " + Titles.MAX_CHARS + " characters");
    }
    List<StoredAnswer> answers = library.list(search, s);
    Map<String, Object> out = new LinkedHashMap<>();
    out.put("approvalRequired", gate.approvalRequired());
    out.put("answers", answers);
    return out;
  }

  @GetMapping("/api/v1/answers/changes")
  List<AnswerChange> allChanges() throws IOException {
    synced();
    return library.changes(null, AUDIT_SHOWN);
  }

  @GetMapping("/api/v1/answers/{id}")
  Map<String, Object> one(@PathVariable("id") String id) throws IOException {
    synced();
    StoredAnswer a = library.find(id).orElseThrow(() -> new AnswerLibrary.UnknownAnswer(id));
    Map<String, Object> out = new LinkedHashMap<>();
    out.put("answer", a);
    out.put("recentEdits", library.recentEdits(id, EDITS_SHOWN));
    out.put("changes", library.changes(id, AUDIT_SHOWN));
    return out;
  }

  @PutMapping(path = "/api/v1/answers/{id}", consumes = MediaType.APPLICATION_JSON_VALUE)
  StoredAnswer edit(@PathVariable("id") String id, @Valid @RequestBody AnswerRequests.Edit e,
      Principal who) throws IOException {
    synced();
    String title = e.title().strip();
    String text = e.text().strip();
    checkText("title", title);
    checkText("text", text);
    columns.check("text", text, "library_answer", "body");
    String reason = reason(e.reason());
    return library.edit(id, e.version(), title, text, who.getName(), reason);
  }

  @PostMapping(path = "/api/v1/answers/{id}/approval",
      consumes = MediaType.APPLICATION_JSON_VALUE)
  StoredAnswer approve(@PathVariable("id") String id,
      @Valid @RequestBody AnswerRequests.StateChange c, Principal who) throws IOException {
    synced();
    return library.approve(id, c.version(), who.getName(), reason(c.reason()));
  }

  @PostMapping(path = "/api/v1/answers/{id}/retirement",
      consumes = MediaType.APPLICATION_JSON_VALUE)
  StoredAnswer retire(@PathVariable("id") String id,
      @Valid @RequestBody AnswerRequests.StateChange c, Principal who) throws IOException {
    synced();
    return library.retire(id, c.version(), who.getName(), reason(c.reason()));
  }

  private String reason(String given) {
    String reason = given.strip();
    checkText("reason", reason);
    columns.check("reason", reason, "library_answer_change", "reason");
    return reason;
  }

  /**
   * Text is kept as typed (markup included: the pages show it as text), but control characters
   * other than line breaks and tabs have no place in a reply and would hide what is sent.
   */
  static void checkText(String field, String text) {
    for (int i = 0; i < text.length(); i++) {
      char c = text.charAt(i);
      if ((Character.isISOControl(c) && c != '\n' && c != '\t' && c != '\r')
          || Character.getType(c) == Character.FORMAT) {
        throw new FieldProblem(field, String.format(Locale.ROOT,
            "holds the invisible or control character U+%04X at position %d", (int) c, i + 1));
      }
    }
  }

  @ExceptionHandler(AnswerLibrary.UnknownAnswer.class)
  ProblemDetail unknown(AnswerLibrary.UnknownAnswer e) {
    ProblemDetail p = ProblemDetail.forStatusAndDetail(HttpStatus.NOT_FOUND, e.getMessage());
    p.setTitle("No such answer");
    return p;
  }

  @ExceptionHandler(AnswerLibrary.Conflict.class)
  ProblemDetail conflict(AnswerLibrary.Conflict e) {
    ProblemDetail p = ProblemDetail.forStatusAndDetail(HttpStatus.CONFLICT, e.getMessage());
    p.setTitle("Answer changed meanwhile");
    return p;
  }
}
