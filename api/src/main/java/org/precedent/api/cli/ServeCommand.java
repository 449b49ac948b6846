package org.precedent.api.cli;

import java.io.PrintWriter;
import java.util.List;
import java.util.concurrent.Callable;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.knowledge.store.DataDir;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(name = "serve", mixinStandardHelpOptions = true,
    description = {"Runs the HTTP service and its pages on the active model.",
        "It serves suggestions, decisions, the ticket queue, feedback, thresholds and model "
            + "versions as JSON under /api/v1, described in OpenAPI at /api/v1/openapi. Stop it "
            + "with Ctrl-C; queued tickets are kept.",
        "Further settings go after the options as --name=value; application.properties lists "
            + "them."})
final class ServeCommand implements Callable<Integer> {
  @ParentCommand
  PrecedentCommand parent;

  @Spec
  CommandSpec spec;

  @Option(names = "--port", paramLabel = "N", defaultValue = "8080",
      description = "Port to listen on (default ${DEFAULT-VALUE}; 0 picks a free one).")
  int port;

  @Parameters(paramLabel = "SETTING", arity = "0..*",
      description = "Service settings, like --precedent.security.users=... (after --).")
  List<String> settings;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    DataDir dataDir = new DataDir(parent.dataDir());
    // Said here in one line rather than as a failed start of the whole application.
    if (dataDir.currentGeneration().isEmpty()) {
      spec.commandLine().getErr().println("precedent serve: no tickets in " + dataDir.root()
          + " yet: run 'precedent ingest FILE' first (or 'precedent demo')");
      return PrecedentCommand.FAILED;
    }
    if (new ModelStore(dataDir.models()).activeVersion().isEmpty()) {
      spec.commandLine().getErr().println("precedent serve: no trained model in " + dataDir.root()
          + " yet: run 'precedent train' first");
      return PrecedentCommand.FAILED;
    }
    return Serving.run(out, spec.commandLine().getErr(), parent.dataDir(), port,
        settings == null ? List.of() : settings);
  }
}
