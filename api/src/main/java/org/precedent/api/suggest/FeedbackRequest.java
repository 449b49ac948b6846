package org.precedent.api.suggest;

import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Size;
import org.precedent.api.system.Limits;

/**
 * What an agent did with a suggested answer.
 *
 * @param ticketId    the ticket it was for, if there is one
 * @param question    the question the suggestion answered
 * @param answerGroup the suggested answer's id
 * @param verdict     ACCEPTED, EDITED or REJECTED
 * @param finalText   the text the agent sent; required when EDITED
 * @param suggestedText the suggestion's text as the agent saw it (for ACCEPTED, the text sent),
 *                    so that training learns from what was sent even once the group's text changed
 * @param propose     EDITED only: offer the sent text to the library's managers as the answer's
 *                    next version
 */
record FeedbackRequest(
    @Size(max = Limits.NAME_CHARS, message = "must be at most {max} characters") String ticketId,
    @NotBlank(message = "must not be empty")
    @Size(max = Limits.QUESTION_CHARS, message = "must be at most {max} characters")
    String question,
    @NotBlank(message = "must not be empty")
    @Size(max = Limits.NAME_CHARS, message = "must be at most {max} characters")
    String answerGroup,
    @NotNull(message = "must be ACCEPTED, EDITED or REJECTED") Verdict verdict,
    @Size(max = Limits.QUESTION_CHARS, message = "must be at most {max} characters")
    String finalText,
    @Size(max = Limits.QUESTION_CHARS, message = "must be at most {max} characters")
    String suggestedText,
    Boolean propose) {

  /** What the agent did. */
  enum Verdict { ACCEPTED, EDITED, REJECTED }
}
