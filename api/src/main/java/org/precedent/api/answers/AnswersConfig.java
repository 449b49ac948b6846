package org.precedent.api.answers;

import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.transaction.support.TransactionTemplate;

/** The library over the service's database. */
@Configuration
class AnswersConfig {
  @Bean
  AnswerLibrary answerLibrary(JdbcTemplate db, TransactionTemplate tx) {
    return new AnswerLibrary(db, tx);
  }
}
