package org.precedent.api.system;

import io.swagger.v3.oas.models.Components;
import io.swagger.v3.oas.models.OpenAPI;
import io.swagger.v3.oas.models.info.Info;
import io.swagger.v3.oas.models.security.SecurityRequirement;
import io.swagger.v3.oas.models.security.SecurityScheme;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/**
 * The service's OpenAPI description ({@code /api/v1/openapi}, browsable at {@code /api/v1/docs}):
 * its name, version and purpose, and the two ways to sign in, so that calls tried from the page
 * carry credentials.
 */
@Configuration
class ApiDescription {
  static final String TITLE = "Precedent API";
  /** The product's version, as {@code precedent --version} prints it. */
  static final String VERSION = "0.1.0";

  @Bean
  OpenAPI precedentApi() {
    return new OpenAPI()
        .info(new Info().title(TITLE).version(VERSION)
            .description("""
                Proposes answers to new help-desk questions from a team's own resolved tickets, \
                with the past tickets behind each, and decides whether to reply automatically or \
                hand off to a person. Questions about health and safety, money or legal matters \
                are always handed off, with the caution to give the customer.

                Sign in with an API key in the `X-Precedent-Key` header or with HTTP basic \
                credentials. Roles: **agent** (suggestions, decisions, feedback, reading the \
                answer library and the queue's tickets), **queue** (submit tickets, read their decisions), **manager** \
                (threshold, model versions, the answer library's edits, approvals and \
                retirements, metrics). Errors are RFC 9457 problem details; too many failed sign-ins are \
                answered 429 with Retry-After."""))
        .components(new Components()
            .addSecuritySchemes("apiKey", new SecurityScheme().type(SecurityScheme.Type.APIKEY)
                .in(SecurityScheme.In.HEADER).name(SignInFilter.HEADER))
            .addSecuritySchemes("basic", new SecurityScheme().type(SecurityScheme.Type.HTTP)
                .scheme("basic")))
        // Either scheme will do.
        .addSecurityItem(new SecurityRequirement().addList("apiKey"))
        .addSecurityItem(new SecurityRequirement().addList("basic"));
  }
}
