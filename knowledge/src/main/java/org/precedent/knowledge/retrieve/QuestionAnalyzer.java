package org.precedent.knowledge.retrieve;

import java.io.Reader;
import java.util.regex.Pattern;
import org.apache.lucene.analysis.Analyzer;
import org.apache.lucene.analysis.LowerCaseFilter;
import org.apache.lucene.analysis.StopFilter;
import org.apache.lucene.analysis.TokenStream;
import org.apache.lucene.analysis.en.EnglishAnalyzer;
import org.apache.lucene.analysis.en.EnglishPossessiveFilter;
import org.apache.lucene.analysis.en.PorterStemFilter;
import org.apache.lucene.analysis.pattern.PatternReplaceCharFilter;
import org.apache.lucene.analysis.standard.StandardTokenizer;

/**
 * Lucene's English analysis chain (as in its EnglishAnalyzer, without a stem-exclusion set), with
 * one change: redaction placeholders such as {@code [ACCOUNT]} are removed before tokenizing.
 * Nearly every ticket carries one, so they say nothing about the topic, and as words they would
 * match the ordinary word "account" in a question. Offsets stay those of the original text, so
 * highlighting still marks the right characters.
 */
final class QuestionAnalyzer extends Analyzer {
  private static final Pattern PLACEHOLDER = Pattern.compile(
      "\\[(?:URL|EMAIL|PHONE|CARD|IBAN|ACCOUNT)\\]");

  @Override
  protected Reader initReader(String fieldName, Reader reader) {
    return new PatternReplaceCharFilter(PLACEHOLDER, " ", reader);
  }

  @Override
  protected TokenStreamComponents createComponents(String fieldName) {
    StandardTokenizer source = new StandardTokenizer();
    TokenStream result = new EnglishPossessiveFilter(source);
    result = new LowerCaseFilter(result);
    result = new StopFilter(result, EnglishAnalyzer.ENGLISH_STOP_WORDS_SET);
    result = new PorterStemFilter(result);
    return new TokenStreamComponents(source, result);
  }

  @Override
  protected TokenStream normalize(String fieldName, TokenStream in) {
    return new LowerCaseFilter(in);
  }
}
