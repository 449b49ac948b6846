package org.precedent.api.answers;

import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Size;

/** What a manager sends to change an answer; every change names the version it was made on. */
final class AnswerRequests {
  private AnswerRequests() {}

  /**
   * A new title and text.
   *
   * @param version the answer's version the editor read
   * @param reason  why: kept in the audit record
   */
  record Edit(
      @NotNull(message = "must be the version you read (a number)") Integer version,
      @NotBlank(message = "must not be empty")
      @Size(max = Titles.MAX_CHARS, message = "must be at most {max} characters") String title,
      // Its length is checked against the library's column (AuditColumns).
      @NotBlank(message = "must not be empty") String text,
      @NotBlank(message = "must say why the answer changes (kept in the audit record)")
      String reason) {}

  /**
   * An approval or a retirement.
   *
   * @param version the answer's version the manager read
   * @param reason  why: kept in the audit record
   */
  record StateChange(
      @NotNull(message = "must be the version you read (a number)") Integer version,
      @NotBlank(message = "must say why (kept in the audit record)") String reason) {}
}
