package org.precedent.api.system;

/** One field of a request is wrong in a way annotations cannot say (it depends on another field). */
public final class FieldProblem extends RuntimeException {
  private final String field;

  public FieldProblem(String field, String message) {
    super(message);
    this.field = field;
  }

  public String field() {
    return field;
  }
}
