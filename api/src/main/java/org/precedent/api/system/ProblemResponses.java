package org.precedent.api.system;

import com.fasterxml.jackson.databind.ObjectMapper;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.util.LinkedHashMap;
import java.util.Map;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.security.access.AccessDeniedException;
import org.springframework.security.core.AuthenticationException;
import org.springframework.security.web.AuthenticationEntryPoint;
import org.springframework.security.web.access.AccessDeniedHandler;
import org.springframework.stereotype.Component;

/** 401, 403 and 429 as RFC 9457 problem details, like every other error of the service. */
@Component
class ProblemResponses implements AuthenticationEntryPoint, AccessDeniedHandler {
  private final ObjectMapper json = new ObjectMapper();

  @Override
  public void commence(HttpServletRequest request, HttpServletResponse response,
      AuthenticationException e) throws IOException {
    // The pages mark their calls; they ask for credentials themselves, so the browser's own
    // password dialog must not pop up over them.
    if (!"XMLHttpRequest".equals(request.getHeader("X-Requested-With"))) {
      response.setHeader("WWW-Authenticate", "Basic realm=\"precedent\"");
    }
    String detail = request.getHeader(SignInFilter.HEADER) != null ? e.getMessage()
        : request.getHeader("Authorization") != null ? "user name or password is wrong"
        : "send an API key in the " + SignInFilter.HEADER + " header, or HTTP basic credentials";
    write(request, response, HttpStatus.UNAUTHORIZED, detail);
  }

  @Override
  public void handle(HttpServletRequest request, HttpServletResponse response,
      AccessDeniedException e) throws IOException {
    write(request, response, HttpStatus.FORBIDDEN, "your role may not "
        + request.getMethod() + " " + request.getRequestURI());
  }

  /** Too many failed sign-ins: 429 with Retry-After (RFC 6585, RFC 9110 section 10.2.3). */
  void tooManyFailures(HttpServletRequest request, HttpServletResponse response,
      SignInLimiter.Refusal refusal) throws IOException {
    response.setHeader("Retry-After", Long.toString(refusal.retryAfterSeconds()));
    write(request, response, HttpStatus.TOO_MANY_REQUESTS, refusal.detail() + "; try again in "
        + refusal.retryAfterSeconds() + " s");
  }

  private void write(HttpServletRequest request, HttpServletResponse response, HttpStatus status,
      String detail) throws IOException {
    Map<String, Object> body = new LinkedHashMap<>();
    body.put("type", "about:blank");
    body.put("title", status.getReasonPhrase());
    body.put("status", status.value());
    body.put("detail", detail);
    body.put("instance", request.getRequestURI());
    response.setStatus(status.value());
    response.setContentType(MediaType.APPLICATION_PROBLEM_JSON_VALUE);
    json.writeValue(response.getOutputStream(), body);
  }
}
