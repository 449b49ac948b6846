package org.precedent.engine.evaluate;

import java.io.IOException;
import java.nio.file.Path;
import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.function.Function;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.evaluate.HeldOutRuns.HeldOutQuestion;
import org.precedent.knowledge.group.AnswerGroup;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.ingest.Ingestor;
import org.precedent.knowledge.io.AtomicFiles;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.ticket.Ticket;

/**
 * An evaluation of what is in force on held-out tickets (never ingested): each ticket's truth, the
 * three systems run as the service would decide, and the reports written.
 *
 * @param report         the report
 * @param questions      the held-out questions and their truth
 * @param html           where the HTML report was written
 * @param json           where the JSON report was written
 * @param safetyHandOffs tickets the gate before the threshold hands off whatever the confidence
 */
public record HeldOutEvaluation(EvaluationReport report, List<HeldOutQuestion> questions,
    Path html, Path json, long safetyHandOffs) {
  public HeldOutEvaluation {
    questions = List.copyOf(questions);
  }

  /**
   * Evaluates and writes a JSON and an HTML report, stamped with the time, into {@code out}; the
   * JSON also becomes the data directory's {@link DataDir#latestReport()}, which the manager's page
   * reads, wherever {@code out} is.
   *
   * @param previous an earlier report to show changes against, or null
   */
  public static HeldOutEvaluation run(DataDir dataDir, InForce active,
      Ingestor.ParsedExport heldOut, String dataset, double target, Path out,
      EvaluationReport previous, Progress progress) throws IOException {
    List<HeldOutQuestion> questions = truth(active, heldOut.tickets());
    EvaluationReport report = measure(active, questions, dataset, target, progress);
    return written(dataDir, questions, report, out, previous);
  }

  /**
   * Writes the reports of a version already measured ({@link #measure}) as {@link #run} writes
   * them: how a candidate measured beside the version in force becomes the latest report once it
   * is in force, without measuring it again.
   */
  public static HeldOutEvaluation written(DataDir dataDir, InForce opened,
      Ingestor.ParsedExport heldOut, EvaluationReport report, Path out, EvaluationReport previous)
      throws IOException {
    return written(dataDir, truth(opened, heldOut.tickets()), report, out, previous);
  }

  private static HeldOutEvaluation written(DataDir dataDir, List<HeldOutQuestion> questions,
      EvaluationReport report, Path out, EvaluationReport previous) throws IOException {
    AtomicFiles.createPrivateDirectories(out);
    AtomicFiles.createPrivateDirectories(dataDir.reports());
    String stamp = DateTimeFormatter.ofPattern("yyyyMMdd-HHmmss").withZone(ZoneOffset.UTC)
        .format(Instant.now());
    Path json = out.resolve("evaluation-" + stamp + ".json");
    Path html = out.resolve("evaluation-" + stamp + ".html");
    ReportFiles.writeJson(report, json);
    ReportFiles.writeJson(report, dataDir.latestReport());
    ReportFiles.writeHtml(HtmlReport.render(report, previous), html);
    return new HeldOutEvaluation(report, questions, html, json,
        fused(report).safetyHandOffs());
  }

  /**
   * Measures the version {@code opened} holds on held-out tickets, writing nothing: how a candidate
   * version is measured beside the version in force, on the same tickets and the same truth.
   */
  public static EvaluationReport measure(InForce opened, Ingestor.ParsedExport heldOut,
      String dataset, double target, Progress progress) {
    return measure(opened, truth(opened, heldOut.tickets()), dataset, target, progress);
  }

  private static EvaluationReport measure(InForce opened, List<HeldOutQuestion> questions,
      String dataset, double target, Progress progress) {
    var runs = HeldOutRuns.asServed(opened.pipeline(), questions, progress);
    return EvaluationReports.build(dataset + " (model " + opened.version() + ")", runs, target);
  }

  /**
   * The right answer of each held-out ticket: its label when a label column is mapped (out of
   * scope when no group has it), else the answer group its reply reuses, if any.
   */
  static List<HeldOutQuestion> truth(InForce active, List<Ticket> tickets) {
    var grouping = active.knowledge().grouping();
    Function<String, java.util.Optional<AnswerGroup>> replyMatcher =
        AnswerGrouper.standard().matcher(grouping);
    Map<String, AnswerGroup> groups = grouping.byId();
    List<HeldOutQuestion> questions = new ArrayList<>();
    for (Ticket t : tickets) {
      String right = t.label() != null ? (groups.containsKey(t.label()) ? t.label() : null)
          : replyMatcher.apply(t.reply()).map(AnswerGroup::id).orElse(null);
      questions.add(new HeldOutQuestion(t.id(), t.question(), t.category(), right));
    }
    return questions;
  }

  /**
   * The deciding system's part of a report: the last, the one the service decides with (the
   * cascade with a dense leg, else fused, as {@code -Dprecedent.reranker} sets).
   */
  public static SystemReport fused(EvaluationReport report) {
    return report.systems().get(report.systems().size() - 1);
  }

  /** The deciding system's guaranteed threshold, when one could be guaranteed at the target. */
  public java.util.OptionalDouble guaranteedThreshold() {
    var r = fused(report).recommendation();
    return r.repliesAutomatically() ? java.util.OptionalDouble.of(r.threshold())
        : java.util.OptionalDouble.empty();
  }

  /** Held-out tickets with a known answer. */
  public long inScope() {
    return questions.stream().filter(q -> q.rightGroup() != null).count();
  }
}
