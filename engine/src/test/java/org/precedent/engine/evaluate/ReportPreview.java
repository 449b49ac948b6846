package org.precedent.engine.evaluate;

import java.io.IOException;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import java.util.Random;

/**
 * Renders a report from synthetic runs so the page can be looked at (not a test). Usage:
 * {@code ReportPreview [html-path]}; writes the HTML and a JSON beside it.
 */
final class ReportPreview {
  private static final String[] CATEGORIES = {
    "Billing", "Sign-in & access", "Shipping", "Returns", "Device setup", "<Other>"};

  private ReportPreview() {}

  public static void main(String[] args) throws IOException {
    Path html = Path.of(args.length > 0 ? args[0] : "/tmp/report.html");
    int tickets = 1200;
    EvaluationReport earlier = EvaluationReports.build("Held-out tickets, spring sample", List.of(
            run("Keyword baseline", tickets, 0.45, 0.9, 11, 31),
            run("Reranker", tickets, 0.62, 1.3, 12, 32)),
        0.95, OptionalDouble.empty(), Instant.parse("2024-02-01T08:00:00Z"));
    EvaluationReport now = EvaluationReports.build("Held-out tickets, spring sample", List.of(
            run("Keyword baseline", tickets, 0.45, 0.9, 11, 31),
            run("Reranker", tickets, 0.66, 1.5, 22, 42),
            run("Reranker with calibrated confidence", tickets, 0.66, 1.9, 22, 43)),
        0.95, OptionalDouble.empty(), Instant.parse("2024-03-01T08:00:00Z"));
    ReportFiles.writeHtml(HtmlReport.render(now, earlier), html);
    ReportFiles.writeJson(now, html.resolveSibling("report.json"));
  }

  /**
   * Synthetic run: each ticket's right answer lands at rank 1 with probability {@code top1} (else a
   * later rank or absent); confidence is a noisy logistic of whether the reply is right, sharper with
   * larger {@code separation}. Runs sharing a rank seed rank alike and
   * differ only in confidence. Ticket ids, categories and scope depend only on the ticket index, so
   * all runs cover the same tickets.
   */
  static SystemRun run(String name, int n, double top1, double separation, long rankSeed, long noiseSeed) {
    Random scope = new Random(7);
    Random r = new Random(rankSeed);
    Random noise = new Random(noiseSeed);
    List<EvaluatedTicket> out = new ArrayList<>(n);
    for (int i = 0; i < n; i++) {
      boolean inScope = scope.nextDouble() < 0.88;
      String category = CATEGORIES[(int) Math.floor(Math.pow(scope.nextDouble(), 1.6) * CATEGORIES.length)];
      int rank = 0;
      if (inScope) {
        double u = r.nextDouble();
        rank = u < top1 ? 1 : u < 0.93 ? 2 + r.nextInt(25) : 0;
      }
      boolean right = inScope && rank == 1;
      double logit = (right ? separation : -separation) + noise.nextGaussian() * 1.2 + 0.3;
      double confidence = 1.0 / (1.0 + Math.exp(-logit));
      out.add(new EvaluatedTicket("T" + i, category, inScope, rank, Math.round(confidence * 1e4) / 1e4));
    }
    return new SystemRun(name, out);
  }
}
