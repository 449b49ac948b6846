package org.precedent.api.system;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.util.List;
import java.util.Optional;
import org.springframework.security.authentication.BadCredentialsException;
import org.springframework.security.authentication.UsernamePasswordAuthenticationToken;
import org.springframework.security.core.authority.SimpleGrantedAuthority;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.security.web.AuthenticationEntryPoint;
import org.springframework.web.filter.OncePerRequestFilter;

/** Authenticates a request that carries an API key in the {@value #HEADER} header. */
final class ApiKeyFilter extends OncePerRequestFilter {
  static final String HEADER = "X-Precedent-Key";

  private final Credentials credentials;
  private final AuthenticationEntryPoint entryPoint;

  ApiKeyFilter(Credentials credentials, AuthenticationEntryPoint entryPoint) {
    this.credentials = credentials;
    this.entryPoint = entryPoint;
  }

  @Override
  protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response,
      FilterChain chain) throws ServletException, IOException {
    String presented = request.getHeader(HEADER);
    if (presented == null) {
      chain.doFilter(request, response);
      return;
    }
    Optional<Credentials.Entry> key = credentials.key(presented.strip());
    if (key.isEmpty()) {
      // A wrong key is refused outright rather than falling back to anonymous access.
      entryPoint.commence(request, response,
          new BadCredentialsException("the API key in " + HEADER + " is not known"));
      return;
    }
    Credentials.Entry e = key.get();
    var auth = new UsernamePasswordAuthenticationToken(e.name(), null,
        List.of(new SimpleGrantedAuthority("ROLE_" + e.role().toUpperCase(java.util.Locale.ROOT))));
    SecurityContextHolder.getContext().setAuthentication(auth);
    try {
      chain.doFilter(request, response);
    } finally {
      SecurityContextHolder.clearContext();
    }
  }
}
