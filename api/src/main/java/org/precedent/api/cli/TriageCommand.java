package org.precedent.api.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.precedent.api.triage.TriageRun;
import org.precedent.engine.decide.InForce;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.ingest.ColumnMapping;
import org.precedent.knowledge.ingest.ExportFormat;
import org.precedent.knowledge.ingest.IngestException;
import org.precedent.knowledge.ingest.Ingestor;
import org.precedent.knowledge.ingest.NewTicket;
import org.precedent.knowledge.store.DataDir;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

@Command(name = "triage", mixinStandardHelpOptions = true,
    description = {"Decides a file of new tickets, resumably.",
        "It reads CSV or JSON Lines with the same column options and rules as ingest (no "
            + "reply column needed) and writes one JSON line per ticket: reply or hand-off, with reason, "
            + "confidence, caution and explanation.",
        "Interrupted, it resumes where it stopped when run again with the same --in and --out."})
final class TriageCommand implements Callable<Integer> {
  @ParentCommand
  PrecedentCommand parent;

  @Spec
  CommandSpec spec;

  @Option(names = "--in", required = true, paramLabel = "FILE", description = "New tickets.")
  Path in;

  @Option(names = "--out", required = true, paramLabel = "FILE",
      description = "Decisions as JSON Lines (FILE.progress beside it while unfinished).")
  Path output;

  @Option(names = "--format", paramLabel = "csv|jsonl",
      description = "Input format. Default: from the file name, JSON Lines for the endings "
          + "jsonl, ndjson and json.")
  String format;

  @Option(names = "--commit-every", paramLabel = "N", defaultValue = "50",
      description = "Decisions forced to disk together (default ${DEFAULT-VALUE}).")
  int commitEvery;

  @Mixin
  ColumnOptions columns;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    PrintWriter err = spec.commandLine().getErr();
    DataDir dataDir = new DataDir(parent.dataDir());
    List<NewTicket> tickets;
    try {
      ColumnMapping mapping = columns.newTicketMapping(in, spec);
      ExportFormat f = format == null ? ExportFormat.of(in)
          : ExportFormat.valueOf(format.toUpperCase(Locale.ROOT));
      // Read as ingest reads: the same rules, and the data directory's own contact details kept.
      tickets = Ingestor.of(dataDir, AnswerGrouper.standard()).readNew(in, f, mapping);
    } catch (IllegalArgumentException | IngestException e) {
      err.println("precedent triage: " + e.getMessage());
      return PrecedentCommand.FAILED;
    }
    NumericLibrary.announce(err);
    try (InForce active = InForce.open(dataDir)) {
      TriageRun.Result r = new TriageRun(active.pipeline(), active.version(), commitEvery)
          .run(tickets, Files.size(in), output);
      if (r.resumedAt() > 0) {
        out.printf(Locale.ROOT, "resumed after %,d tickets already decided%n", r.resumedAt());
      }
      out.printf(Locale.ROOT, "%s: %,d tickets decided with model %s: %,d replies, %,d hand-offs, "
          + "%,d rows with errors%n", output, r.decided(), active.version(), r.replies(),
          r.handOffs(), r.errors());
      return r.errors() > 0 ? PrecedentCommand.ROWS_REJECTED : 0;
    } catch (IllegalStateException e) {
      err.println("precedent triage: " + e.getMessage());
      return PrecedentCommand.FAILED;
    }
  }
}
