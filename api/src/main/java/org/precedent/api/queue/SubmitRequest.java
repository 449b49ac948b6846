package org.precedent.api.queue;

import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.Pattern;
import jakarta.validation.constraints.Size;
import org.precedent.api.system.Limits;

/**
 * A new ticket for the queue. Submitting the same id again returns the first submission's state.
 *
 * @param ticketId the ticket's id in the caller's system
 * @param question the customer's text as received
 * @param category its category, if known
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
    String category) {}
