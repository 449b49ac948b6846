package org.precedent.api.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.api.testing.ChildJvm;
import org.precedent.api.testing.TrainedData;

/**
 * What the commands that use the numeric library print, in a JVM of their own as a user runs them:
 * a notice before the native code loads, none of the library's debugging lines, counts as integers.
 */
class NumericLibraryTest {
  private static final String NOTICE = "precedent: loading the numeric library";

  @TempDir
  Path tmp;

  private Path data;

  @AfterEach
  void removeData() {
    TrainedData.delete(data);
  }

  @Test
  void trainSaysTheLibraryIsLoadingShowsNoLibraryChatterAndCountsInIntegers() throws Exception {
    data = TrainedData.copy();
    Path log = tmp.resolve("train.log");
    Path temp = Files.createDirectories(tmp.resolve("system-temp"));
    try (ChildJvm child = ChildJvm.start(log, List.of("-Djava.io.tmpdir=" + temp), "--data",
        data.toString(), "train", "--epochs", "1", "--hidden", "16", "--embedding", "16",
        "--vocabulary", "500", "--answer-tokens", "16")) {
      assertEquals(0, child.waitFor(), child.tail());
    }
    String out = Files.readString(log);
    assertNoticeOnceBefore(out, "model v-");
    assertFalse(out.contains("Added differentiated op"), out);
    assertTrue(Pattern.compile("questions \\d+ ").matcher(out).find(), out);
    assertFalse(Pattern.compile("questions [0-9,]+\\.\\d").matcher(out).find(), out);
    try (Stream<Path> left = Files.list(temp)) {
      assertEquals(List.of(), left.toList(), "training writes nothing to the system temp folder");
    }
  }

  @Test
  void askSaysTheLibraryIsLoadingBeforeItAnswersAndOnlyWhenTheRerankerIsNeeded() throws Exception {
    data = TrainedData.copy();
    String question = "my green bin was not emptied this week";
    Path settled = tmp.resolve("ask-settled.log");
    try (ChildJvm child = ChildJvm.start(settled, "--data", data.toString(), "ask", question)) {
      assertEquals(0, child.waitFor(), child.tail());
    }
    String out = Files.readString(settled);
    // The faster legs agree on this one (the decision says so): no network, no library, no notice.
    if (out.contains("reranker not run: BM25, the dense leg and their fusion agree")) {
      assertFalse(out.contains(NOTICE), out);
    }
    Path reranked = tmp.resolve("ask-reranked.log");
    try (ChildJvm child = ChildJvm.start(reranked, List.of("-Dprecedent.reranker=always"),
        "--data", data.toString(), "ask", question)) {
      assertEquals(0, child.waitFor(), child.tail());
    }
    assertNoticeOnceBefore(Files.readString(reranked), "question: ");
  }

  private static void assertNoticeOnceBefore(String out, String later) {
    int notice = out.indexOf(NOTICE);
    assertTrue(notice >= 0, "no notice in:\n" + out);
    assertEquals(notice, out.lastIndexOf(NOTICE), "said once:\n" + out);
    assertTrue(out.indexOf(later) > notice, "the notice comes before '" + later + "':\n" + out);
  }
}
