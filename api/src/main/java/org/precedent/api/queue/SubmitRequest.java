package org.precedent.api.queue;

import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.Pattern;
import jakarta.validation.constraints.Size;
import java.util.Map;
import org.precedent.api.system.Limits;

/**
 * A new ticket for the queue. Submitting the same id again returns the first submission's state.
 *
 * @param ticketId the ticket's id in the caller's system
 * @param question the customer's text as received
 * @param category its category, if known
 * @param fields   the ticket's own fields by name (a collection day, a reference), if any: an
 *                 answer's slot is filled from the field {@code DIR/slot-fields.properties} names
 */
record SubmitRequest(
    @NotBlank(message = "must not be empty")
    @Size(max = Limits.NAME_CHARS, message = "must be at most {max} characters")
    @Pattern(regexp = "[\\p{Alnum}._:\\-]+",
        message = "may hold only letters, digits and . _ : -")
    String ticketId,
    @NotBlank(message = "must not be empty")
    @Size(max = Limits.QUESTION_CHARS, message = "must be at most {max} characters")
    String question,
    @Size(max = Limits.NAME_CHARS, message = "must be at most {max} characters")
    String category,
    @Size(max = SubmitRequest.MAX_FIELDS, message = "may hold at most {max} fields")
    Map<String, String> fields) {
  static final int MAX_FIELDS = 20;
  static final int FIELD_CHARS = 1000;

  /** A ticket without fields of its own. */
  SubmitRequest(String ticketId, String question, String category) {
    this(ticketId, question, category, null);
  }
}
