package org.precedent.api.suggest;

import jakarta.validation.constraints.Max;
import jakarta.validation.constraints.Min;
import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.Size;
import org.precedent.api.system.Limits;
import org.precedent.knowledge.ticket.Category;

/**
 * A question to answer.
 *
 * @param question the customer's text as received (it is cleaned and redacted before use)
 * @param category the ticket's category, if known: category thresholds and rules then apply
 * @param limit    how many ranked answers to return (1 to 20)
 */
record QuestionRequest(
    @NotBlank(message = "must not be empty")
    @Size(max = Limits.QUESTION_CHARS, message = "must be at most {max} characters")
    String question,
    @Size(max = Limits.NAME_CHARS, message = "must be at most {max} characters")
    String category,
    @Min(value = 1, message = "must be at least {value}")
    @Max(value = 20, message = "must be at most {value}")
    Integer limit) {

  int limitOr(int fallback) {
    return limit == null ? fallback : limit;
  }

  String categoryOrNull() {
    return Category.normalise(category);
  }
}
