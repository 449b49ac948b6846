package org.precedent.knowledge.retrieve;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.junit.jupiter.api.Test;

class QuestionAnalyzerTest {
  @Test
  void placeholdersAreNotTermsAndOffsetsStayThoseOfTheText() throws Exception {
    List<String> terms = new java.util.ArrayList<>();
    List<String> spans = new java.util.ArrayList<>();
    String text = "My account [ACCOUNT] was billed twice, call [PHONE]";
    try (var analyzer = new QuestionAnalyzer();
        var stream = analyzer.tokenStream("question", text)) {
      var term = stream.addAttribute(
          org.apache.lucene.analysis.tokenattributes.CharTermAttribute.class);
      var offset = stream.addAttribute(
          org.apache.lucene.analysis.tokenattributes.OffsetAttribute.class);
      stream.reset();
      while (stream.incrementToken()) {
        terms.add(term.toString());
        spans.add(text.substring(offset.startOffset(), offset.endOffset()));
      }
      stream.end();
    }
    // Porter stemming (Porter 1980): billed -> bill, twice -> twice; "my" is no Lucene stop word.
    assertEquals(List.of("my", "account", "bill", "twice", "call"), terms);
    assertEquals(List.of("My", "account", "billed", "twice", "call"), spans);
  }
}
