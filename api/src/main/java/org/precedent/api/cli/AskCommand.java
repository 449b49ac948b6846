package org.precedent.api.cli;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.retrieve.RetrievalSettings;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(name = "ask", mixinStandardHelpOptions = true,
    description = {"Shows the best candidate answers for a question, with scores and evidence.",
        "With no question, reads questions line by line until end of input."})
final class AskCommand implements Callable<Integer> {
  @ParentCommand
  PrecedentCommand parent;

  @Spec
  CommandSpec spec;

  @Parameters(paramLabel = "QUESTION", arity = "0..*", description = "The question (quoted).")
  List<String> words;

  @Option(names = "--candidates", paramLabel = "N", defaultValue = "5",
      description = "Candidate answers shown (default ${DEFAULT-VALUE}).")
  int candidates;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    DataDir dataDir = new DataDir(parent.dataDir());
    Optional<Knowledge> opened = Knowledge.open(dataDir);
    if (opened.isEmpty()) {
      spec.commandLine().getErr().println("precedent ask: no tickets in " + dataDir.root()
          + " yet: run 'precedent ingest FILE' first (or 'precedent demo')");
      return PrecedentCommand.FAILED;
    }
    TextCleaner cleaner = TextCleaner.standard();
    RetrievalSettings settings = RetrievalSettings.standard().withCandidates(candidates);
    RetrievalPrinter printer = new RetrievalPrinter(out, 160);
    try (Knowledge knowledge = opened.get()) {
      if (words != null && !words.isEmpty()) {
        printer.print(knowledge.retriever().retrieve(
            cleaner.cleanQuestion(String.join(" ", words)), settings));
        return 0;
      }
      boolean console = System.console() != null;
      BufferedReader in = new BufferedReader(new InputStreamReader(System.in, StandardCharsets.UTF_8));
      if (console) {
        out.println("Type a question and press Enter; end with Ctrl-D.");
      }
      String line;
      while (true) {
        if (console) {
          out.print("> ");
          out.flush();
        }
        if ((line = in.readLine()) == null) {
          break;
        }
        if (!line.isBlank()) {
          printer.print(knowledge.retriever().retrieve(cleaner.cleanQuestion(line), settings));
        }
      }
    }
    return 0;
  }
}
