package org.precedent.api.system;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.http.HttpHeaders;
import org.springframework.http.HttpStatus;
import org.springframework.http.HttpStatusCode;
import org.springframework.http.ProblemDetail;
import org.springframework.http.ResponseEntity;
import org.springframework.http.converter.HttpMessageNotReadableException;
import org.springframework.validation.FieldError;
import org.springframework.web.bind.MethodArgumentNotValidException;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.RestControllerAdvice;
import org.springframework.web.context.request.WebRequest;
import org.springframework.web.servlet.mvc.method.annotation.ResponseEntityExceptionHandler;

/**
 * Every error as an RFC 9457 problem detail; invalid fields are listed under {@code errors}, each
 * with its field and what is wrong with it.
 */
@RestControllerAdvice
class ErrorAdvice extends ResponseEntityExceptionHandler {
  private static final Logger LOG = LoggerFactory.getLogger(ErrorAdvice.class);

  @Override
  protected ResponseEntity<Object> handleMethodArgumentNotValid(MethodArgumentNotValidException e,
      HttpHeaders headers, HttpStatusCode status, WebRequest request) {
    List<Map<String, String>> errors = new ArrayList<>();
    for (FieldError f : e.getBindingResult().getFieldErrors()) {
      errors.add(Map.of("field", f.getField(), "message", String.valueOf(f.getDefaultMessage())));
    }
    e.getBindingResult().getGlobalErrors().forEach(g ->
        errors.add(Map.of("field", g.getObjectName(), "message",
            String.valueOf(g.getDefaultMessage()))));
    String detail = errors.stream().map(m -> m.get("field") + ": " + m.get("message"))
        .collect(Collectors.joining("; "));
    ProblemDetail p = ProblemDetail.forStatusAndDetail(HttpStatus.BAD_REQUEST, detail);
    p.setTitle("Invalid request");
    p.setProperty("errors", errors);
    return ResponseEntity.badRequest().body(p);
  }

  @Override
  protected ResponseEntity<Object> handleHttpMessageNotReadable(HttpMessageNotReadableException e,
      HttpHeaders headers, HttpStatusCode status, WebRequest request) {
    for (Throwable t = e; t != null; t = t.getCause()) {
      if (t instanceof RequestSizeFilter.TooLarge tooLarge) {
        ProblemDetail p = ProblemDetail.forStatusAndDetail(HttpStatus.PAYLOAD_TOO_LARGE,
            tooLarge.getMessage());
        return ResponseEntity.status(HttpStatus.PAYLOAD_TOO_LARGE).body(p);
      }
    }
    ProblemDetail p = ProblemDetail.forStatus(HttpStatus.BAD_REQUEST);
    p.setTitle("Unreadable request");
    BodyProblem problem = BodyProblem.of(e);
    if (problem != null && problem.field() != null) {
      p.setDetail(problem.field() + ": " + problem.message());
      p.setProperty("errors", List.of(Map.of("field", problem.field(), "message",
          problem.message())));
    } else if (problem != null) {
      p.setDetail(problem.message());
    } else if (e.getMessage() != null && e.getMessage().startsWith("Required request body")) {
      p.setDetail("the request has no body; send a JSON object");
    } else {
      p.setDetail("the request body is not the JSON expected");
    }
    return ResponseEntity.badRequest().body(p);
  }

  @ExceptionHandler(FieldProblem.class)
  ProblemDetail fieldProblem(FieldProblem e) {
    ProblemDetail p = ProblemDetail.forStatusAndDetail(HttpStatus.BAD_REQUEST,
        e.field() + ": " + e.getMessage());
    p.setTitle("Invalid request");
    p.setProperty("errors", List.of(Map.of("field", e.field(), "message", e.getMessage())));
    return p;
  }

  @ExceptionHandler(DecisionSlots.Busy.class)
  ResponseEntity<ProblemDetail> busy(DecisionSlots.Busy e) {
    ProblemDetail p = ProblemDetail.forStatusAndDetail(HttpStatus.SERVICE_UNAVAILABLE,
        e.getMessage() + "; try again in " + e.retryAfterSeconds() + " s");
    p.setTitle("Busy");
    return ResponseEntity.status(HttpStatus.SERVICE_UNAVAILABLE)
        .header(HttpHeaders.RETRY_AFTER, String.valueOf(e.retryAfterSeconds())).body(p);
  }

  @ExceptionHandler(org.precedent.engine.rerank.ModelLoadException.class)
  ProblemDetail modelUnusable(org.precedent.engine.rerank.ModelLoadException e) {
    ProblemDetail p = ProblemDetail.forStatusAndDetail(HttpStatus.UNPROCESSABLE_ENTITY,
        e.getMessage() + "; the model in force is unchanged");
    p.setTitle("Model cannot be used");
    return p;
  }

  @ExceptionHandler(IllegalArgumentException.class)
  ProblemDetail badArgument(IllegalArgumentException e) {
    ProblemDetail p = ProblemDetail.forStatusAndDetail(HttpStatus.BAD_REQUEST, e.getMessage());
    p.setTitle("Invalid request");
    return p;
  }

  /** Storage that fails (a full disk) is the service's problem: 503, and the caller tries again. */
  @ExceptionHandler(org.springframework.dao.DataAccessException.class)
  ResponseEntity<ProblemDetail> database(org.springframework.dao.DataAccessException e) {
    if (!StorageFailures.isStorageFailure(e)) {
      return ResponseEntity.internalServerError().body(unexpected(e));
    }
    LOG.warn("storage failed: {}", StorageFailures.describe(e));
    ProblemDetail p = ProblemDetail.forStatusAndDetail(HttpStatus.SERVICE_UNAVAILABLE,
        "the service cannot store or read data right now (" + StorageFailures.describe(e)
            + "); nothing of this request was kept: send it again later");
    p.setTitle("Storage unavailable");
    return ResponseEntity.status(HttpStatus.SERVICE_UNAVAILABLE)
        .header(HttpHeaders.RETRY_AFTER, "30").body(p);
  }

  @ExceptionHandler(Exception.class)
  ProblemDetail unexpected(Exception e) {
    LOG.error("request failed", e);
    ProblemDetail p = ProblemDetail.forStatusAndDetail(HttpStatus.INTERNAL_SERVER_ERROR,
        "the service could not complete this request (" + e.getClass().getSimpleName()
            + "); the error is in the service log");
    return p;
  }
}
