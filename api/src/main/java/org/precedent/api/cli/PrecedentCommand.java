package org.precedent.api.cli;

import java.nio.file.Path;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.ScopeType;

/** The {@code precedent} command line: one entry point, one sub-command per job. */
@Command(name = "precedent", mixinStandardHelpOptions = true, version = "precedent 0.1.0",
    description = "Proposes past answers to new help-desk questions, learned from resolved tickets.",
    subcommands = {IngestCommand.class, AskCommand.class, TrainCommand.class, EvaluateCommand.class,
        ActivateCommand.class,
        ServeCommand.class, TriageCommand.class,
        DemoCommand.class,
        BenchmarkCommand.class, CommandLine.HelpCommand.class})
public final class PrecedentCommand {
  /** Exit status when some rows of an ingested file were rejected (the good rows are stored). */
  static final int ROWS_REJECTED = 3;
  /** Exit status when the command could not do its job at all. */
  static final int FAILED = 1;
  /** Columns of help text: a classic terminal's width. */
  static final int HELP_WIDTH = 80;

  @Option(names = "--data", paramLabel = "DIR", scope = ScopeType.INHERIT,
      description = "Data directory: tickets, index, models. Default: $PRECEDENT_DATA, else "
          + "~/.precedent")
  Path data;

  Path dataDir() {
    if (data != null) {
      return data;
    }
    String env = System.getenv("PRECEDENT_DATA");
    return env != null && !env.isBlank() ? Path.of(env)
        : Path.of(System.getProperty("user.home"), ".precedent");
  }

  public static void main(String[] args) {
    // Precedent's own output goes to the real standard output; libraries print through a filter.
    java.io.PrintStream stdout = System.out;
    System.setOut(new java.io.PrintStream(new LibraryChatter(stdout), true));
    System.exit(run(new java.io.PrintWriter(stdout, true), new java.io.PrintWriter(System.err, true),
        args));
  }

  /** Runs the command line and returns its exit status, without exiting. */
  public static int run(String... args) {
    return run(new java.io.PrintWriter(System.out, true), new java.io.PrintWriter(System.err, true),
        args);
  }

  /** Runs the command line writing to {@code out} and {@code err}; returns the exit status. */
  public static int run(java.io.PrintWriter out, java.io.PrintWriter err, String... args) {
    CommandLine cli = new CommandLine(new PrecedentCommand());
    // One width everywhere, so that help wraps the same in every terminal, pipe and test.
    cli.setUsageHelpAutoWidth(false);
    cli.setUsageHelpWidth(HELP_WIDTH);
    DemoCommand.describeDataOption(cli.getSubcommands().get("demo").getCommandSpec());
    cli.setOut(out);
    cli.setErr(err);
    cli.setExecutionExceptionHandler((e, line, parsed) -> {
      line.getErr().println("precedent: " + Messages.oneLine(e));
      return FAILED;
    });
    return cli.execute(args);
  }
}
