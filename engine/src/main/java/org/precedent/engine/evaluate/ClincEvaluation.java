package org.precedent.engine.evaluate;

import java.io.IOException;
import java.io.PrintStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.evaluate.HeldOutRuns.HeldOutQuestion;
import org.precedent.engine.fusion.FusionQuestion;
import org.precedent.engine.learn.TeamModelTrainer;
import org.precedent.engine.learn.TrainingReport;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.engine.rerank.TrainingPair;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.datasets.Clinc150;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.ingest.Ingestor;
import org.precedent.knowledge.io.AtomicFiles;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;
import org.precedent.knowledge.ticket.Ticket;

/**
 * Precedent on CLINC150 as Larson et al. (2019) run it: trained on "train", the threshold tuned on
 * "val" + "oos_val", tested on "test" + "oos_test"; in-scope accuracy and out-of-scope recall at
 * the validation-tuned threshold, for each scoring system, next to the paper's Table 2.
 *
 * @param scope      "full" or the domain's name
 * @param train      labelled training tickets (the answer groups are the intents)
 * @param validation validation questions, out-of-scope ones with no right group
 * @param test       test questions, out-of-scope ones with no right group
 */
public record ClincEvaluation(String scope, List<Ticket> train, List<FusionQuestion> validation,
    List<HeldOutQuestion> test) {

  /** The paper's figures this is read beside. */
  public static final String PUBLISHED = "Larson et al. 2019, Table 2 (Full, oos-threshold): "
      + "BERT 96.2 / 52.3, MLP 93.4 / 49.1, CNN 90.9 / 30.9, FastText 88.6 / 28.3, linear SVM 88.2 / 18.0";

  private static final TextCleaner CLEANER = TextCleaner.standard();

  public ClincEvaluation {
    train = List.copyOf(train);
    validation = List.copyOf(validation);
    test = List.copyOf(test);
  }

  /** One system's figures on the test questions at the threshold tuned on validation. */
  public record Row(String system, double threshold, double inScopeAccuracy,
      double outOfScopeRecall) {}

  /** What a run measured, and how training went. */
  public record Result(String trainingSummary, double trainingSeconds, List<Row> rows) {
    public Result {
      rows = List.copyOf(rows);
    }
  }

  /** The questions of one domain (out-of-scope queries included), or of all 150 intents. */
  public static ClincEvaluation of(Clinc150 clinc, String domain) {
    Set<String> intents = domain == null ? clinc.allIntents() : clinc.intents(domain);
    List<FusionQuestion> validation = new ArrayList<>();
    questions(clinc, "val", intents).forEach(q -> validation.add(
        new FusionQuestion(q.ticketId(), q.question(), q.rightGroup(), false)));
    questions(clinc, "oos_val", null).forEach(q -> validation.add(
        new FusionQuestion(q.ticketId(), q.question(), null, false)));
    List<HeldOutQuestion> test = new ArrayList<>(questions(clinc, "test", intents));
    test.addAll(questions(clinc, "oos_test", null));
    return new ClincEvaluation(domain == null ? "full" : domain,
        Clinc150.tickets(clinc.split("train", intents), "train", CLEANER), validation, test);
  }

  /**
   * Ingests the training tickets into a scratch data directory under {@code scratch}, trains a
   * model with at most {@code epochs} reranker epochs, and measures; the scratch directory is
   * deleted afterwards. Progress lines go to {@code progress}.
   */
  public Result run(Path scratch, int epochs, PrintStream progress) throws IOException {
    Path work = Files.createTempDirectory(scratch, "precedent-clinc-");
    try {
      DataDir dataDir = new DataDir(work.resolve("data"));
      new Ingestor(dataDir, CLEANER, AnswerGrouper.standard()).store(new Ingestor.ParsedExport(
          "CLINC150 " + scope + " train", train.size(), 0, train, List.of(), List.of()),
          new Progress("indexing", "tickets", progress));
      Knowledge knowledge = Knowledge.open(dataDir).orElseThrow();
      List<TrainingPair> pairs = train.stream()
          .map(t -> new TrainingPair(t.question(), t.reply())).toList();
      long start = System.nanoTime();
      // Intent names are 2 to 4 words, learned better with a smaller step than the default.
      TrainingReport report = new TeamModelTrainer(dataDir, RerankerConfig.defaults()
          .withEpochs(epochs, RerankerConfig.defaults().patience()).withLearningRate(2e-3))
          .train(knowledge, pairs, validation, false);
      double seconds = (System.nanoTime() - start) / 1e9;
      try (InForce active = InForce.open(dataDir)) {
        List<HeldOutQuestion> val = validation.stream().map(v -> new HeldOutQuestion(v.ticketId(),
            v.question(), "clinc", v.rightGroup())).toList();
        List<SystemRun> valRuns = HeldOutRuns.modelAlone(active.pipeline(), val,
            new Progress("scoring validation", "queries", progress));
        List<SystemRun> testRuns = HeldOutRuns.modelAlone(active.pipeline(), test,
            new Progress("scoring test", "queries", progress));
        List<Row> rows = new ArrayList<>();
        for (int s = 0; s < testRuns.size(); s++) {
          double t = bestThreshold(valRuns.get(s).tickets());
          double[] figures = atThreshold(testRuns.get(s).tickets(), t);
          rows.add(new Row(testRuns.get(s).name(), t, figures[0], figures[1]));
        }
        return new Result(report.summary(), seconds, rows);
      }
    } finally {
      AtomicFiles.deleteTree(work);
    }
  }

  private static List<HeldOutQuestion> questions(Clinc150 clinc, String split,
      Set<String> intents) {
    List<HeldOutQuestion> out = new ArrayList<>();
    List<Clinc150.Example> examples = clinc.split(split, intents);
    for (int i = 0; i < examples.size(); i++) {
      boolean outOfScope = intents == null;
      out.add(new HeldOutQuestion(split + "-" + i, CLEANER.cleanQuestion(examples.get(i).query()),
          "clinc", outOfScope ? null : examples.get(i).intent()));
    }
    return out;
  }

  /**
   * The threshold that maximises in-scope accuracy plus out-of-scope recall on validation
   * questions: the paper tunes its threshold on validation without saying for what, and this
   * weighs the two figures it reports equally.
   */
  static double bestThreshold(List<EvaluatedTicket> tickets) {
    double best = 0;
    double bestScore = -1;
    for (int step = 0; step <= 200; step++) {
      double t = step / 200.0;
      double[] f = atThreshold(tickets, t);
      if (f[0] + f[1] > bestScore) {
        bestScore = f[0] + f[1];
        best = t;
      }
    }
    return best;
  }

  /** {in-scope accuracy, out-of-scope recall} when answering only at confidence >= t. */
  static double[] atThreshold(List<EvaluatedTicket> tickets, double t) {
    int inScope = 0;
    int right = 0;
    int outOfScope = 0;
    int rejected = 0;
    for (EvaluatedTicket e : tickets) {
      if (e.inScope()) {
        inScope++;
        right += e.rankOfRight() == 1 && e.confidence() >= t ? 1 : 0;
      } else {
        outOfScope++;
        rejected += e.confidence() < t ? 1 : 0;
      }
    }
    return new double[] {inScope == 0 ? Double.NaN : right / (double) inScope,
        outOfScope == 0 ? Double.NaN : rejected / (double) outOfScope};
  }
}
