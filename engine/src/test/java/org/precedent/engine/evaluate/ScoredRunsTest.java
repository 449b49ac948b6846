package org.precedent.engine.evaluate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.engine.evaluate.HeldOutRuns.HeldOutQuestion;
import org.precedent.engine.fusion.ScoringSystem;

class ScoredRunsTest {
  @TempDir
  Path tmp;

  private static final List<ScoringSystem> SYSTEMS = List.of(ScoringSystem.BM25,
      ScoringSystem.FUSED);
  private static final List<HeldOutQuestion> TWO = List.of(
      new HeldOutQuestion("a", "how do i freeze my card", "clinc", "freeze_account"),
      new HeldOutQuestion("b", "what is the meaning of life", "clinc", null));

  /** Writes two systems' scores of two questions as a run of a benchmark would leave them. */
  private Path kept(String model) throws IOException {
    Path file = tmp.resolve("scores.tsv");
    String bm25 = ScoringSystem.BM25.label();
    String fused = ScoringSystem.FUSED.label();
    Files.writeString(file, "# model " + model + "\n# systems " + bm25 + "," + fused + "\n"
        + "split\tsystem\tticket\tin_scope\trank\tconfidence\treranked\n"
        + "test\t" + bm25 + "\ta\ttrue\t2\t0.1234567890123\tfalse\n"
        + "test\t" + bm25 + "\tb\tfalse\t0\t0.5\tfalse\n"
        + "test\t" + fused + "\ta\ttrue\t1\t0.75\ttrue\n"
        + "test\t" + fused + "\tb\tfalse\t0\t0.25\ttrue\n");
    return file;
  }

  @Test
  void keptScoresOfTheSameModelAreReadBackWithEveryDigit() throws IOException {
    kept("m1");
    ByteArrayOutputStream said = new ByteArrayOutputStream();
    // No pipeline: scoring would fail, so the figures can only come from the file.
    List<SystemRun> runs = new ScoredRuns(tmp.resolve("scores.tsv"), "m1", SYSTEMS)
        .runs("test", null, TWO, new PrintStream(said, true, StandardCharsets.UTF_8));
    assertEquals(ScoringSystem.FUSED.label(), runs.get(1).name());
    assertEquals(0.1234567890123, runs.get(0).tickets().get(0).confidence(), 0);
    assertEquals(2, runs.get(0).tickets().get(0).rankOfRight());
    assertTrue(runs.get(1).tickets().get(1).reranked());
    assertTrue(said.toString(StandardCharsets.UTF_8).contains("scored before"));
  }

  @Test
  void scoresOfAnotherModelAreNotReadBack() throws IOException {
    kept("m1");
    assertTrue(new ScoredRuns(tmp.resolve("scores.tsv"), "m1", SYSTEMS).holds("test", 2));
    assertFalse(new ScoredRuns(tmp.resolve("scores.tsv"), "m2", SYSTEMS).holds("test", 2));
    // Other systems (another reranker setting) or another number of questions: scored again.
    assertFalse(new ScoredRuns(tmp.resolve("scores.tsv"), "m1",
        List.of(ScoringSystem.BM25)).holds("test", 2));
    assertFalse(new ScoredRuns(tmp.resolve("scores.tsv"), "m1", SYSTEMS).holds("test", 3));
    assertFalse(new ScoredRuns(tmp.resolve("scores.tsv"), "m1", SYSTEMS).holds("validation", 2));
  }

  @Test
  void aDamagedLineIsNamedWithItsField() throws IOException {
    Path file = kept("m1");
    Files.writeString(file, Files.readString(file).replace("0.75", "0.7.5"));
    IOException e = assertThrows(IOException.class, () -> new ScoredRuns(file, "m1", SYSTEMS));
    assertTrue(e.getMessage().startsWith(file + ":6: "), e.getMessage());
    assertTrue(e.getMessage().contains(":6: confidence is '0.7.5'"), e.getMessage());
    Files.writeString(file, Files.readString(file).replace("0.7.5\ttrue", "0.75\tyes"));
    e = assertThrows(IOException.class, () -> new ScoredRuns(file, "m1", SYSTEMS));
    assertTrue(e.getMessage().contains(":6: reranked is 'yes'"), e.getMessage());
  }
}
