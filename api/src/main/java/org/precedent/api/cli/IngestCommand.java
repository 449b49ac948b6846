package org.precedent.api.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.ingest.ColumnMapping;
import org.precedent.knowledge.ingest.ExportFormat;
import org.precedent.knowledge.ingest.IngestException;
import org.precedent.knowledge.ingest.IngestReport;
import org.precedent.knowledge.ingest.Ingestor;
import org.precedent.knowledge.ingest.RowProblem;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.store.DataDir;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(name = "ingest", mixinStandardHelpOptions = true,
    description = {"Stores resolved tickets from a CSV (RFC 4180, UTF-8) or JSON Lines export.",
        "Tickets are cleaned and redacted first. A ticket id stored before is updated, not "
            + "duplicated; within one file, a row that repeats the id of an earlier row is rejected "
            + "and the earlier row kept.",
        "Which column holds what comes from --mapping FILE (lines key=column, with the keys id, "
            + "question, subject, body, reply, label, category, created), from the column options, "
            + "or from a mapping.properties beside the export.",
        "Exit status: 0 when every row is stored, 3 when some rows are rejected (the others are "
            + "stored), 1 when nothing is stored."})
final class IngestCommand implements Callable<Integer> {
  @ParentCommand
  PrecedentCommand parent;

  @Spec
  CommandSpec spec;

  @Parameters(paramLabel = "FILE", description = "The export to read.")
  Path file;

  @Option(names = "--format", paramLabel = "csv|jsonl",
      description = "File format. Default: from the file name, JSON Lines for the endings "
          + "jsonl, ndjson and json.")
  String format;

  @Mixin
  ColumnOptions columns;

  @Option(names = "--show-problems", paramLabel = "N", defaultValue = "20",
      description = "Rejected rows listed at most (default ${DEFAULT-VALUE}; all are counted).")
  int showProblems;

  @Option(names = "--quiet", description = "No progress lines.")
  boolean quiet;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    PrintWriter err = spec.commandLine().getErr();
    IngestReport report;
    try {
      ColumnMapping mapping = columns.mapping(file, spec);
      ExportFormat exportFormat = format == null ? ExportFormat.of(file)
          : ExportFormat.valueOf(format.toUpperCase(Locale.ROOT));
      DataDir dataDir = new DataDir(parent.dataDir());
      Ingestor ingestor;
      try {
        ingestor = Ingestor.of(dataDir, AnswerGrouper.standard());
      } catch (java.io.IOException e) {
        err.println("precedent ingest: " + e.getMessage());
        err.println("nothing was stored; the data directory is as it was.");
        return PrecedentCommand.FAILED;
      }
      report = ingestor.ingest(file, exportFormat, mapping,
          progress("reading " + file.getFileName(), "rows"), progress("indexing", "tickets"));
    } catch (IllegalArgumentException e) {
      err.println("precedent ingest: " + e.getMessage());
      return PrecedentCommand.FAILED;
    } catch (IngestException e) {
      err.println("precedent ingest: " + e.getMessage());
      err.println("nothing was stored; the data directory is as it was.");
      return PrecedentCommand.FAILED;
    }
    print(report, out, err);
    return report.rejected() > 0 ? PrecedentCommand.ROWS_REJECTED : 0;
  }

  private Progress progress(String what, String unit) {
    return quiet ? Progress.silent() : new Progress(what, unit, System.err);
  }

  private void print(IngestReport r, PrintWriter out, PrintWriter err) {
    for (int i = 0; i < Math.min(showProblems, r.problems().size()); i++) {
      RowProblem p = r.problems().get(i);
      err.println("rejected: " + p);
    }
    if (r.problems().size() > showProblems) {
      err.printf(Locale.ROOT, "... and %,d more problems (--show-problems N lists more)%n",
          r.problems().size() - showProblems);
    }
    out.printf(Locale.ROOT, "%s: read %,d, stored %,d, updated %,d, rejected %,d%n",
        r.file(), r.read(), r.stored(), r.updated(), r.rejected());
    out.printf(Locale.ROOT, "knowledge: %,d tickets, %,d answer groups, %,d one-off tickets%n",
        r.totalTickets(), r.groupSizes().size(), r.oneOffs());
    out.println("groups by " + r.method() + ":");
    for (IngestReport.GroupSize g : r.groupSizes()) {
      out.printf(Locale.ROOT, "  %-14s %5d  %-12s %s%n", g.id(), g.size(),
          g.category() == null ? "-" : g.category(), Text.abbreviate(g.canonical(), 60));
    }
    if (!r.proposedOwnDetails().isEmpty()) {
      out.println("redacted from the replies of several answer groups, so perhaps your own: if so, "
          + "add these lines to " + new DataDir(parent.dataDir()).ownDetails()
          + " and ingest again to keep them in answers:");
      for (IngestReport.ProposedDetail d : r.proposedOwnDetails()) {
        out.printf(Locale.ROOT, "  %s %-40s # in %,d groups, %,d replies%n", d.kind(), d.value(),
            d.groups(), d.tickets());
      }
    }
  }
}
