package org.precedent.engine.evaluate;

import java.io.IOException;
import java.io.PrintStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.HashSet;
import java.util.Locale;
import java.util.Optional;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.decide.Pipeline;
import org.precedent.engine.fusion.FusionFit;
import org.precedent.engine.fusion.FusionModel;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.knowledge.embed.Encoders;
import org.precedent.knowledge.embed.SentenceEncoder;
import org.precedent.knowledge.store.Manifest;
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

  /**
   * One system's figures: on the in-scope test questions with no threshold, and on every test
   * question at the threshold tuned on validation (with what that threshold gave on validation, to
   * read how well it carried over).
   *
   * @param inScopeTop1          share of in-scope test questions whose right intent ranks first
   * @param threshold            the threshold tuned on validation ({@link #bestThreshold})
   * @param inScopeAccuracy      in-scope test questions answered, and right, at the threshold
   * @param outOfScopeRecall     out-of-scope test questions held back by the threshold
   * @param validationInScope    the same on validation
   * @param validationOutOfScope the same on validation
   * @param reranked             share of test questions the system ran the reranker for
   */
  public record Row(String system, double inScopeTop1, double threshold, double inScopeAccuracy,
      double outOfScopeRecall, double validationInScope, double validationOutOfScope,
      double reranked) {}

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
   * Ingests the training tickets into {@code work}, trains a model there with at most {@code
   * epochs} reranker epochs, scores validation and test, and measures. Everything is kept in
   * {@code work}, so a run that is interrupted continues where it stopped: the knowledge (with its
   * vectors) is not stored again, an unfinished reranker resumes from its checkpoint, a finished
   * model is not trained again, and scored questions are read back. Progress lines go to {@code
   * progress}.
   *
   * @throws IllegalStateException if {@code work} holds another run's tickets
   */
  public Result run(Path work, int epochs, PrintStream progress) throws IOException {
    Files.createDirectories(work);
    DataDir dataDir = new DataDir(work.resolve("data"));
    Knowledge knowledge = knowledge(dataDir, progress);
    // The reranker learns from every training ticket: validation, not a share of train, is what
    // fusion and the threshold are fitted on, as the paper keeps validation for tuning.
    List<TrainingPair> pairs = train.stream()
        .map(t -> new TrainingPair(t.question(), t.reply())).toList();
    // Intent names are 2 to 4 words, learned better with a smaller step than the default.
    TeamModelTrainer trainer = new TeamModelTrainer(dataDir, RerankerConfig.defaults()
        .withEpochs(epochs, RerankerConfig.defaults().patience()).withLearningRate(2e-3));
    ModelStore store = new ModelStore(dataDir.models());
    Optional<String> trained = trainer.currentVersion(knowledge, pairs);
    TrainingReport report;
    if (trained.isPresent()) {
      progress.printf(Locale.ROOT, "model %s in %s was trained on these tickets: not trained "
          + "again%n", trained.get(), work);
      report = new TrainingReport(trained.get(), false,
          store.trainingMetrics(trained.get()).orElseThrow(),
          FusionFit.summary(FusionModel.load(store.directory(trained.get()))));
    } else {
      report = trainer.train(knowledge, pairs, validation, true);
      if (!report.activated()) {
        store.activate(report.version());
      }
    }
    try (InForce active = InForce.open(dataDir)) {
      Pipeline pipeline = active.pipeline();
      List<HeldOutQuestion> val = validation.stream().map(v -> new HeldOutQuestion(v.ticketId(),
          v.question(), "clinc", v.rightGroup())).toList();
      ScoredRuns scores = new ScoredRuns(work.resolve("scores-" + report.version() + ".tsv"),
          store.fingerprint(report.version()), pipeline.systems());
      List<SystemRun> valRuns = scores.runs("validation", pipeline, val, progress);
      List<SystemRun> testRuns = scores.runs("test", pipeline, test, progress);
      List<Row> rows = new ArrayList<>();
      for (int s = 0; s < testRuns.size(); s++) {
        List<EvaluatedTicket> v = valRuns.get(s).tickets();
        List<EvaluatedTicket> t = testRuns.get(s).tickets();
        double threshold = bestThreshold(v);
        double[] onTest = atThreshold(t, threshold);
        double[] onValidation = atThreshold(v, threshold);
        rows.add(new Row(testRuns.get(s).name(), inScopeTop1(t), threshold, onTest[0], onTest[1],
            onValidation[0], onValidation[1],
            t.stream().filter(EvaluatedTicket::reranked).count() / (double) t.size()));
      }
      return new Result(report.summary(), report.reranker().trainingMillis() / 1000.0, rows);
    }
  }

  /**
   * The knowledge of the training tickets in {@code dataDir}: what is there when it holds exactly
   * these tickets, with vectors of the encoder in use (if any), else stored now.
   */
  private Knowledge knowledge(DataDir dataDir, PrintStream progress) throws IOException {
    Set<String> ids = new HashSet<>();
    train.forEach(t -> ids.add(t.id()));
    Optional<Knowledge> current = Knowledge.open(dataDir);
    Optional<SentenceEncoder.Model> encoder = Encoders.fromSetting();
    if (current.isPresent()) {
      if (!current.get().tickets().keySet().equals(ids)) {
        throw new IllegalStateException(dataDir.root() + " holds " + current.get().tickets()
            .size() + " tickets that are not CLINC150 " + scope + "'s " + ids.size()
            + " training queries: give another --work directory or delete it");
      }
      Manifest.Vectors vectors = current.get().manifest().vectors();
      if (encoder.isEmpty() ? vectors == null
          : vectors != null && vectors.encoder().equals(encoder.get().name())) {
        progress.printf(Locale.ROOT, "knowledge in %s holds the %,d training queries%s: not "
            + "stored again%n", dataDir.root(), ids.size(),
            vectors == null ? "" : " and their vectors (" + vectors.encoder() + ")");
        return current.get();
      }
    }
    new Ingestor(dataDir, CLEANER, AnswerGrouper.standard()).withEncoder(encoder).store(
        new Ingestor.ParsedExport("CLINC150 " + scope + " train", train.size(), 0, train,
            List.of(), List.of()),
        new Progress("indexing", "tickets", progress),
        new Progress("embedding", "questions", progress));
    return Knowledge.open(dataDir).orElseThrow();
  }

  /** Share of in-scope tickets whose right answer the system ranked first, no threshold. */
  static double inScopeTop1(List<EvaluatedTicket> tickets) {
    long inScope = tickets.stream().filter(EvaluatedTicket::inScope).count();
    return inScope == 0 ? Double.NaN
        : tickets.stream().filter(e -> e.inScope() && e.rankOfRight() == 1).count()
            / (double) inScope;
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
