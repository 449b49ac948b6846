package org.precedent.api.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

class LibraryChatterTest {
  private final ByteArrayOutputStream seen = new ByteArrayOutputStream();
  private final PrintStream out = new PrintStream(new LibraryChatter(seen), true,
      StandardCharsets.UTF_8);

  private String seen() {
    return seen.toString(StandardCharsets.UTF_8);
  }

  @Test
  void dropsTheNumericLibrarysGradientLinesAndPassesEverythingElse() {
    out.println("reranker size: vocabulary 4000");
    out.println("Added differentiated op multi_head_dot_product_attention");
    out.println("Added differentiated op ExternalErrorsFn");
    out.println("scoring 10 candidates: p50 156.3 ms — Added differentiated op is only dropped first");
    assertEquals("reranker size: vocabulary 4000\n"
        + "scoring 10 candidates: p50 156.3 ms — Added differentiated op is only dropped first\n",
        seen());
  }

  @Test
  void aPartialLineIsWrittenOnFlushUnlessItMayStillBeAGradientLine() {
    out.print("> ");
    out.flush();
    assertEquals("> ", seen(), "a prompt shows at once");
    out.print("Added diff");
    out.flush();
    assertEquals("> ", seen(), "held back: it may be the start of a gradient line");
    out.println("erentiated op multiply");
    out.print("Added");
    out.println(" nothing");
    assertEquals("> Added nothing\n", seen());
  }
}
