package org.precedent.api.system;

import com.fasterxml.jackson.databind.cfg.CoercionAction;
import com.fasterxml.jackson.databind.cfg.CoercionInputShape;
import com.fasterxml.jackson.databind.type.LogicalType;
import org.springframework.boot.autoconfigure.jackson.Jackson2ObjectMapperBuilderCustomizer;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/**
 * Text fields take only JSON strings. Jackson would turn {@code 42} or {@code true} into the text
 * "42" or "true", so a client that mixed up its fields would be answered as if it had not; the
 * other strict settings (a field given twice, unknown fields, anything after the object, text for
 * numbers) are in application.properties.
 */
@Configuration
class StrictJson {
  @Bean
  Jackson2ObjectMapperBuilderCustomizer textIsOnlyText() {
    return builder -> builder.postConfigurer(mapper -> mapper.coercionConfigFor(LogicalType.Textual)
        .setCoercion(CoercionInputShape.Integer, CoercionAction.Fail)
        .setCoercion(CoercionInputShape.Float, CoercionAction.Fail)
        .setCoercion(CoercionInputShape.Boolean, CoercionAction.Fail));
  }
}
