package org.precedent.api.cli;

import java.io.PrintWriter;
import java.util.concurrent.Callable;
import org.precedent.api.models.Activations;
import org.precedent.api.models.ModelAudit;
import org.precedent.knowledge.store.DataDir;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(name = "activate", mixinStandardHelpOptions = true,
    description = {"Puts a trained model version in force, showing its comparison.",
        "A version goes in force over the one in force when evaluate compared the two on the same "
            + "held-out tickets and it answers at least as many of them at the target precision. "
            + "A version that answers fewer, or has no comparison that still holds (other "
            + "knowledge, other files), needs --acknowledge beside the reason.",
        "The activation is recorded, with the comparison, in the same audit as the service's; "
            + "it is refused while the service runs on the data directory (activate through the "
            + "service then)."})
final class ActivateCommand implements Callable<Integer> {
  @ParentCommand
  PrecedentCommand parent;

  @Spec
  CommandSpec spec;

  @Parameters(paramLabel = "VERSION", description = "The version to put in force (v-NNNN).")
  String version;

  @Option(names = "--reason", paramLabel = "TEXT", required = true,
      description = "Why the model changes, for the audit.")
  String reason;

  @Option(names = "--acknowledge", description = "Activate it although it is worse than the "
      + "version in force, or not compared with it.")
  boolean acknowledge;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    PrintWriter err = spec.commandLine().getErr();
    if (reason.isBlank()) {
      err.println("precedent activate: --reason: say why the model changes (kept in the audit "
          + "record)");
      return PrecedentCommand.FAILED;
    }
    DataDir dataDir = new DataDir(parent.dataDir());
    Activations.Verdict verdict;
    try {
      verdict = ModelAudit.activateFromCommandLine(dataDir, version,
          System.getProperty("user.name") + " (command line)", reason, acknowledge);
    } catch (ModelAudit.Refused refused) {
      show(out, refused.verdict());
      err.println("precedent activate: " + refused.getMessage());
      return PrecedentCommand.FAILED;
    }
    if (version.equals(verdict.inForce())) {
      out.println("model " + version + " is already in force; nothing changed");
      return 0;
    }
    show(out, verdict);
    if (verdict.needsAcknowledgement()) {
      out.println("acknowledged: " + verdict.objection());
    }
    out.println("model " + version + " is in force"
        + (verdict.inForce() == null ? "" : " (was " + verdict.inForce() + ")"));
    return 0;
  }

  static void show(PrintWriter out, Activations.Verdict verdict) {
    if (verdict.comparison() != null) {
      Activations.lines(verdict.comparison()).forEach(out::println);
    }
  }
}
