package org.precedent.engine.evaluate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ReportFilesTest {
  @TempDir Path dir;

  @Test
  void jsonRoundTripGivesAnEqualReport() throws IOException {
    // The hand set has NaN (login precision) and an infinite threshold (no guarantee), which a naive
    // JSON mapping would lose; the separable set has a certified recommendation.
    EvaluationReport report = Fixtures.report("hand set", Fixtures.sixTickets("A"), Fixtures.sixTicketsImproved("B"));
    Path file = dir.resolve("report.json");
    ReportFiles.writeJson(report, file);
    assertEquals(report, ReportFiles.readJson(file));

    EvaluationReport certified = Fixtures.report("separable", Fixtures.separable("S", "all"));
    ReportFiles.writeJson(certified, file);
    assertEquals(certified, ReportFiles.readJson(file));
  }

  @Test
  void writesLeaveOnlyTheTargetFilesBehind() throws IOException {
    EvaluationReport report = Fixtures.report("hand set", Fixtures.sixTickets("A"));
    ReportFiles.writeJson(report, dir.resolve("report.json"));
    ReportFiles.writeHtml(HtmlReport.render(report, null), dir.resolve("report.html"));
    try (Stream<Path> files = Files.list(dir)) {
      assertEquals(2, files.count(), "no temporary file left beside the targets");
    }
    assertTrue(Files.readString(dir.resolve("report.html")).startsWith("<!DOCTYPE html>"));
  }
}
