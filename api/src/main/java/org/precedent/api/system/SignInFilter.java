package org.precedent.api.system;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.Base64;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.security.authentication.BadCredentialsException;
import org.springframework.security.authentication.UsernamePasswordAuthenticationToken;
import org.springframework.security.core.authority.SimpleGrantedAuthority;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * Signs a request in by the API key in the {@value #HEADER} header or by HTTP basic credentials
 * (RFC 7617). Wrong credentials are refused outright rather than treated as anonymous; each failure
 * is logged (the name, if any, the client address and why, never the secret) and counted by the
 * {@link SignInLimiter}, which refuses further attempts with 429 once a client or a name has failed
 * too often. A request without credentials passes on unsigned, for the access rules to judge.
 */
final class SignInFilter extends OncePerRequestFilter {
  static final String HEADER = "X-Precedent-Key";
  private static final Logger LOG = LoggerFactory.getLogger(SignInFilter.class);
  private static final String BASIC = "basic ";

  private final Credentials credentials;
  private final SignInLimiter limiter;
  private final ProblemResponses problems;

  SignInFilter(Credentials credentials, SignInLimiter limiter, ProblemResponses problems) {
    this.credentials = credentials;
    this.limiter = limiter;
    this.problems = problems;
  }

  /** What a request presents: a key, or a basic name and password (null when unreadable). */
  private record Presented(String key, String name, String password) {}

  @Override
  protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response,
      FilterChain chain) throws ServletException, IOException {
    String key = request.getHeader(HEADER);
    String authorization = request.getHeader("Authorization");
    boolean basic = authorization != null && authorization.length() >= BASIC.length()
        && authorization.regionMatches(true, 0, BASIC, 0, BASIC.length());
    if (key == null && !basic) {
      chain.doFilter(request, response);
      return;
    }
    Presented presented = key != null ? new Presented(key.strip(), null, null)
        : decode(authorization.substring(BASIC.length()).strip());
    String address = request.getRemoteAddr();
    Optional<SignInLimiter.Refusal> refused = limiter.refusal(address, presented.name());
    if (refused.isPresent()) {
      problems.tooManyFailures(request, response, refused.get());
      return;
    }
    Optional<Credentials.Caller> caller;
    String reason;
    if (key != null) {
      caller = credentials.key(presented.key());
      reason = "the API key is not known";
    } else if (presented.password() == null) {
      caller = Optional.empty();
      reason = "the basic credentials are not base64 of name:password";
    } else {
      caller = credentials.user(presented.name(), presented.password());
      reason = credentials.isUser(presented.name()) ? "wrong password" : "no such user";
    }
    if (caller.isEmpty()) {
      LOG.warn("failed sign-in{} from {}: {}", presented.name() == null ? ""
          : " as '" + printable(presented.name()) + "'", address, reason);
      limiter.failed(address, presented.name()).ifPresent(r -> LOG.warn(
          "{}: further sign-ins refused for {} s", r.detail(), r.retryAfterSeconds()));
      problems.commence(request, response, new BadCredentialsException(key != null
          ? "the API key in " + HEADER + " is not known" : "user name or password is wrong"));
      return;
    }
    Credentials.Caller c = caller.get();
    var auth = new UsernamePasswordAuthenticationToken(c.name(), null,
        List.of(new SimpleGrantedAuthority("ROLE_" + c.role().toUpperCase(Locale.ROOT))));
    SecurityContextHolder.getContext().setAuthentication(auth);
    try {
      chain.doFilter(request, response);
    } finally {
      SecurityContextHolder.clearContext();
    }
  }

  private static Presented decode(String token) {
    String text;
    try {
      text = new String(Base64.getDecoder().decode(token), StandardCharsets.UTF_8);
    } catch (IllegalArgumentException notBase64) {
      return new Presented(null, null, null);
    }
    int colon = text.indexOf(':');
    // The name is what comes before the first colon; the password may hold colons (RFC 7617).
    return colon < 0 ? new Presented(null, text, null)
        : new Presented(null, text.substring(0, colon), text.substring(colon + 1));
  }

  /** A caller's text made safe for one log line: no control characters, not too long. */
  static String printable(String s) {
    String shown = s.length() > 80 ? s.substring(0, 80) + "..." : s;
    return shown.replaceAll("\\p{Cntrl}", "?");
  }
}
