package org.precedent.api.system;

/**
 * Sizes the service accepts; longer input is refused with a problem naming the field. What the
 * audit records keep is set by their columns in the migrations ({@link AuditColumns}).
 */
public final class Limits {
  /** Longest question, in characters: far beyond any real ticket, short of abuse. */
  public static final int QUESTION_CHARS = 20_000;
  /** Longest category or ticket id. */
  public static final int NAME_CHARS = 200;

  private Limits() {}
}
