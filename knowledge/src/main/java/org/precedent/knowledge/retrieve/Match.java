package org.precedent.knowledge.retrieve;

/**
 * A span of a past question that matched a term of the new question.
 *
 * @param start offset of the first character, in the evidence text
 * @param end   offset after the last character
 * @param term  the analysed term both share (stemmed, lower case)
 */
public record Match(int start, int end, String term) {}
