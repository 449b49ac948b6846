package org.precedent.api.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.precedent.api.triage.TriageRun;
import org.precedent.api.triage.TriageTicket;
import org.precedent.engine.decide.InForce;
import org.precedent.knowledge.ingest.ExportFormat;
import org.precedent.knowledge.ingest.ExportRows;
import org.precedent.knowledge.ingest.IngestException;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.ticket.Category;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

@Command(name = "triage", mixinStandardHelpOptions = true,
    description = {"Decides a file of new tickets, resumably.",
        "It reads CSV or JSON Lines with the same column options as ingest (no reply column "
            + "needed) and writes one JSON line per ticket: reply or hand-off, with reason, "
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
    List<TriageTicket> tickets;
    try {
      tickets = read(columns.newTicketColumns(in, spec));
    } catch (IllegalArgumentException | IngestException e) {
      err.println("precedent triage: " + e.getMessage());
      return PrecedentCommand.FAILED;
    }
    NumericLibrary.announce(err);
    try (InForce active = InForce.open(new DataDir(parent.dataDir()))) {
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

  private List<TriageTicket> read(Map<String, String> mapped) throws IngestException {
    ExportFormat f = format == null ? ExportFormat.of(in)
        : ExportFormat.valueOf(format.toUpperCase(Locale.ROOT));
    List<ExportRows.Row> rows = ExportRows.read(in, f, new LinkedHashSet<>(mapped.values()));
    List<TriageTicket> tickets = new ArrayList<>();
    String name = in.getFileName().toString();
    for (ExportRows.Row row : rows) {
      String id = mapped.containsKey("id") ? text(row, mapped.get("id")) : name + ":" + row.line();
      if (id.isEmpty()) {
        id = name + ":" + row.line();
      }
      String question = mapped.containsKey("question") ? text(row, mapped.get("question"))
          : String.join("\n", text(row, mapped.get("subject")), text(row, mapped.get("body")))
              .strip();
      String category = Category.normalise(text(row, mapped.get("category")));
      String error = row.error() != null ? in + ": line " + row.line() + ": " + row.error()
          : question.isEmpty() ? in + ": line " + row.line() + ": question: empty"
          : question.length() > 20_000 ? in + ": line " + row.line()
              + ": question: over 20,000 characters" : null;
      tickets.add(new TriageTicket(id, row.line(), question, category,
          error));
    }
    return tickets;
  }

  private static String text(ExportRows.Row row, String column) {
    if (column == null) {
      return "";
    }
    String v = row.values().get(column);
    return v == null ? "" : v.strip();
  }
}
