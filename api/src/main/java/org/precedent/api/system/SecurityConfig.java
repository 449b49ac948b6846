package org.precedent.api.system;

import static org.springframework.http.HttpMethod.GET;
import static org.springframework.http.HttpMethod.POST;
import static org.springframework.http.HttpMethod.PUT;

import jakarta.servlet.http.HttpServletRequest;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.security.config.annotation.web.builders.HttpSecurity;
import org.springframework.security.config.http.SessionCreationPolicy;
import org.springframework.security.web.SecurityFilterChain;
import org.springframework.security.web.authentication.www.BasicAuthenticationFilter;
import org.springframework.security.web.header.writers.DelegatingRequestMatcherHeaderWriter;
import org.springframework.security.web.header.writers.StaticHeadersWriter;

/**
 * Who may do what. Agents ask for suggestions and give feedback; the queue submits tickets;
 * managers change the threshold and the model. Callers prove who they are with an API key or with
 * HTTP basic ({@link SignInFilter}); no sessions are kept.
 */
@Configuration
class SecurityConfig {
  private static final Logger LOG = LoggerFactory.getLogger(SecurityConfig.class);

  // The pages load only their own files and run no inline script, so text that slips into markup
  // by mistake still cannot run.
  static final String PAGE_POLICY = "default-src 'self'; script-src 'self'; style-src 'self'; "
      + "img-src 'self' data:; object-src 'none'; base-uri 'none'; form-action 'self'; "
      + "frame-ancestors 'none'";

  /** The OpenAPI page, and where springdoc serves its files (it redirects from the first). */
  static final String DOCS = "/api/v1/docs";
  static final String DOCS_FILES = "/api/v1/swagger-ui/";
  // The OpenAPI page's script (springdoc's Swagger UI) adds style elements as it draws; scripts
  // stay limited to its own files.
  static final String DOCS_POLICY = PAGE_POLICY.replace("style-src 'self'",
      "style-src 'self' 'unsafe-inline'");

  static boolean isPage(HttpServletRequest request) {
    String path = request.getRequestURI();
    return path.equals("/") || path.equals("/answers") || path.equals("/manage")
        || path.equals("/library") || path.equals("/queue") || path.startsWith("/pages/");
  }

  static boolean isDocs(HttpServletRequest request) {
    String path = request.getRequestURI();
    return path.equals(DOCS) || path.startsWith(DOCS_FILES);
  }

  @Bean
  Credentials credentials(@Value("${precedent.security.users:}") String users,
      @Value("${precedent.security.keys:}") String keys) {
    Credentials c = Credentials.fromSettings(users, keys);
    if (c.demo()) {
      LOG.warn("demo credentials in force (replace them with precedent.security.users or "
          + "precedent.security.keys; either replaces all of them): users agent, manager, queue "
          + "with password <role>-demo-password; API keys demo-agent-key, demo-manager-key, "
          + "demo-queue-key");
    }
    return c;
  }

  @Bean
  SecurityFilterChain api(HttpSecurity http, Credentials credentials, SignInLimiter limiter,
      ProblemResponses problems) throws Exception {
    http.csrf(c -> c.disable())
        .headers(h -> h.addHeaderWriter(new DelegatingRequestMatcherHeaderWriter(
            SecurityConfig::isPage, new StaticHeadersWriter("Content-Security-Policy",
                PAGE_POLICY)))
            .addHeaderWriter(new DelegatingRequestMatcherHeaderWriter(SecurityConfig::isDocs,
                new StaticHeadersWriter("Content-Security-Policy", DOCS_POLICY))))
        .sessionManagement(s -> s.sessionCreationPolicy(SessionCreationPolicy.STATELESS))
        .exceptionHandling(e -> e.authenticationEntryPoint(problems).accessDeniedHandler(problems))
        .addFilterBefore(new SignInFilter(credentials, limiter, problems),
            BasicAuthenticationFilter.class)
        .authorizeHttpRequests(a -> a
            .requestMatchers(GET, "/actuator/health", "/actuator/health/**").permitAll()
            // The OpenAPI description and its page hold no data; calls from the page sign in.
            .requestMatchers(GET, "/api/v1/openapi", "/api/v1/openapi/**", DOCS, DOCS + "/**",
                DOCS_FILES + "**").permitAll()
            // The pages hold no data; they call the API below with the caller's own credentials.
            .requestMatchers(GET, "/", "/answers", "/manage", "/library", "/queue",
                "/pages/**", "/error")
                .permitAll()
            .requestMatchers(GET, "/api/v1/me").authenticated()
            .requestMatchers(POST, "/api/v1/suggestions").hasAnyRole("AGENT", "MANAGER")
            .requestMatchers(POST, "/api/v1/decisions").hasAnyRole("AGENT", "MANAGER", "QUEUE")
            .requestMatchers(POST, "/api/v1/queue/tickets").hasRole("QUEUE")
            .requestMatchers(GET, "/api/v1/queue/tickets").hasAnyRole("AGENT", "MANAGER")
            .requestMatchers(GET, "/api/v1/queue/tickets/*")
                .hasAnyRole("QUEUE", "AGENT", "MANAGER")
            .requestMatchers(POST, "/api/v1/feedback").hasRole("AGENT")
            .requestMatchers(GET, "/api/v1/threshold", "/api/v1/threshold/changes",
                "/api/v1/threshold/evaluation", "/api/v1/threshold/approval").hasRole("MANAGER")
            .requestMatchers(PUT, "/api/v1/threshold").hasRole("MANAGER")
            .requestMatchers("/api/v1/models", "/api/v1/models/**").hasRole("MANAGER")
            // The answer library: agents read it, managers change it.
            .requestMatchers(GET, "/api/v1/answers", "/api/v1/answers/**")
                .hasAnyRole("AGENT", "MANAGER")
            .requestMatchers(PUT, "/api/v1/answers/*").hasRole("MANAGER")
            .requestMatchers(POST, "/api/v1/answers/*/approval", "/api/v1/answers/*/retirement")
                .hasRole("MANAGER")
            .requestMatchers("/actuator/**").hasRole("MANAGER")
            .anyRequest().authenticated());
    return http.build();
  }
}
