package org.precedent.api.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.precedent.api.models.ModelAudit;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.api.suggest.FeedbackTraining;
import org.precedent.engine.learn.TeamModelTrainer;
import org.precedent.engine.learn.TrainingReport;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.engine.rerank.TrainingPair;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

@Command(name = "train", mixinStandardHelpOptions = true,
    description = {"Trains the model on the stored tickets.",
        "The reranker learns from most tickets; fusion and calibration are fitted on tickets kept "
            + "apart. The first version goes in force at once; a later one is a candidate until "
            + "evaluate compares it with the version in force and activate puts it in force "
            + "(or --activate here). Checkpoints are written as it goes; --resume continues an "
            + "interrupted run.",
        "Answers agents accepted or edited and sent are added to the reranker's tickets, read "
            + "from the service's database in the data directory; while the service runs it "
            + "holds that database, and training goes on without them.",
        "--without-reranker writes a version of the faster legs alone (no reranker), in "
            + "seconds; a full version trained later is compared with it as any candidate is."})
final class TrainCommand implements Callable<Integer> {
  @ParentCommand
  PrecedentCommand parent;

  @Spec
  CommandSpec spec;

  @Option(names = "--resume", description = "Continue the last interrupted run.")
  boolean resume;

  @Option(names = "--without-reranker", description = "Write a version without the reranker: "
      + "the dense leg's classifier and fusion over BM25 and the dense leg only (BM25 alone "
      + "without question vectors). Ready in seconds rather than minutes; decisions never run "
      + "the reranker with it.")
  boolean withoutReranker;

  @Option(names = "--activate", description = "Put the new version in force at once, without "
      + "a comparison (recorded in the model audit; refused while the service runs on the data "
      + "directory).")
  boolean activate;

  @Option(names = "--reason", paramLabel = "TEXT",
      description = "Why, for the model audit, with --activate.")
  String reason;

  // RerankerConfig.defaults().maxEpochs(), measured there.
  @Option(names = "--epochs", paramLabel = "N", description = "Most epochs (default ${DEFAULT-VALUE}).",
      defaultValue = "4")
  int epochs;

  @Option(names = "--hidden", paramLabel = "N", description = "LSTM size (default ${DEFAULT-VALUE}).",
      defaultValue = "128")
  int hidden;

  @Option(names = "--embedding", paramLabel = "N",
      description = "Word embedding size (default ${DEFAULT-VALUE}).", defaultValue = "64")
  int embedding;

  @Option(names = "--vocabulary", paramLabel = "N",
      description = "Most words in the vocabulary (default ${DEFAULT-VALUE}).", defaultValue = "4000")
  int vocabulary;

  @Option(names = "--answer-tokens", paramLabel = "N",
      description = "Answer tokens scored at most (default ${DEFAULT-VALUE}).", defaultValue = "32")
  int answerTokens;

  @Option(names = "--learning-rate", paramLabel = "R",
      description = "Adam learning rate (default ${DEFAULT-VALUE}).", defaultValue = "0.005")
  double learningRate;

  @Option(names = "--self-normalization", paramLabel = "ALPHA",
      description = "Train the reranker's output layer self-normalised with this weight of the "
          + "(log Z)^2 penalty, so that scoring reads only the answer words' logits; 0 trains plain "
          + "softmax with exact scores (default ${DEFAULT-VALUE}).", defaultValue = "0")
  double selfNormalization;

  @Option(names = "--batch-size", paramLabel = "N",
      description = "Training pairs per step (default ${DEFAULT-VALUE}).", defaultValue = "32")
  int batchSize;

  @Option(names = "--pairs-per-group", paramLabel = "N",
      description = "Most training questions taken from one answer group, chosen by a hash of the "
          + "ticket id; 0 takes all (default ${DEFAULT-VALUE}).",
      defaultValue = "" + TeamModelTrainer.PAIRS_PER_GROUP)
  int pairsPerGroup;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    DataDir dataDir = new DataDir(parent.dataDir());
    Optional<Knowledge> opened = Knowledge.open(dataDir);
    if (opened.isEmpty()) {
      spec.commandLine().getErr().println("precedent train: no tickets in " + dataDir.root()
          + " yet: run 'precedent ingest FILE' first");
      return PrecedentCommand.FAILED;
    }
    RerankerConfig config = RerankerConfig.defaults().withSizes(embedding, hidden)
        .withVocabulary(vocabulary, RerankerConfig.defaults().minCount())
        .withEpochs(epochs, RerankerConfig.defaults().patience())
        .withMaxTokens(RerankerConfig.defaults().maxQuestionTokens(), answerTokens)
        .withLearningRate(learningRate).withBatchSize(batchSize)
        .withSelfNormalization(selfNormalization);
    NumericLibrary.announce(spec.commandLine().getErr());
    Knowledge knowledge = opened.get();
    TrainingReport report;
    if (withoutReranker) {
      if (resume) {
        throw new picocli.CommandLine.ParameterException(spec.commandLine(),
            "--resume continues a reranker's training; --without-reranker trains none");
      }
      // Feedback trains only the reranker, so a version without it does not read it.
      report = new TeamModelTrainer(dataDir, config).trainWithoutReranker(knowledge);
    } else {
      FeedbackTraining.Read feedback = FeedbackTraining.read(dataDir, knowledge);
      out.println(feedback.summary());
      out.flush();
      List<TrainingPair> pairs = new ArrayList<>(TeamModelTrainer.rerankerPairs(knowledge,
          pairsPerGroup));
      pairs.addAll(feedback.pairs());
      report = new TeamModelTrainer(dataDir, config).train(knowledge, pairs,
          TeamModelTrainer.fusionQuestions(knowledge), resume);
    }
    Path dir = dataDir.models().resolve(report.version());
    out.println(report.summary());
    if (report.activated()) {
      out.printf(Locale.ROOT, "model %s is in force, the first version (%s)%n", report.version(),
          dir);
      return 0;
    }
    String inForce = new ModelStore(dataDir.models()).activeVersion().orElse("none");
    if (!activate) {
      out.printf(Locale.ROOT, "model %s is a candidate (%s); %s stays in force.%n"
          + "Compare them on held-out tickets: precedent evaluate FILE%n"
          + "then put it in force: precedent activate %s --reason TEXT%n", report.version(), dir,
          inForce, report.version());
      return 0;
    }
    try {
      ModelAudit.activateFromCommandLine(dataDir, report.version(),
          System.getProperty("user.name") + " (command line)", reason != null && !reason.isBlank()
              ? reason : "train --activate: put in force without a comparison", true);
    } catch (java.io.IOException e) {
      spec.commandLine().getErr().println("precedent train: " + Messages.oneLine(e)
          + "; model " + report.version() + " stays a candidate");
      return PrecedentCommand.FAILED;
    }
    out.printf(Locale.ROOT, "model %s is in force (was %s; not compared with it) (%s)%n",
        report.version(), inForce, dir);
    return 0;
  }
}
