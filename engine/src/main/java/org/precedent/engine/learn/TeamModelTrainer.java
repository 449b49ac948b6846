package org.precedent.engine.learn;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.precedent.engine.decide.Assembly;
import org.precedent.engine.dense.AnswerClassifier;
import org.precedent.engine.dense.DenseLeg;
import org.precedent.engine.fusion.FusionFit;
import org.precedent.engine.fusion.FusionQuestion;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.engine.rerank.Scorer;
import org.precedent.engine.rerank.TrainedReranker;
import org.precedent.engine.rerank.TrainingPair;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.engine.rerank.train.RerankerTrainer;
import org.precedent.knowledge.embed.QuestionVectors;
import org.precedent.knowledge.group.AnswerGroup;
import org.precedent.knowledge.retrieve.Retriever;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;
import org.precedent.knowledge.store.Manifest;
import org.precedent.knowledge.ticket.Ticket;

/**
 * Trains a team's model from its stored tickets: the reranker (and, when the knowledge holds question
 * vectors, the dense leg's answer classifier) on most grouped tickets, then fusion and calibration
 * on the tickets kept apart ({@link Splits}), one-offs included as questions no answer covers. Writes one model version and makes it active.
 */
public final class TeamModelTrainer {
  private final DataDir dataDir;
  private final RerankerConfig config;

  public TeamModelTrainer(DataDir dataDir, RerankerConfig config) {
    this.dataDir = dataDir;
    this.config = config;
  }

  /**
   * Most training pairs taken from one answer group by default ({@link #rerankerPairs(Knowledge)});
   * 0 takes every ticket.
   */
  public static final int PAIRS_PER_GROUP = 0;

  /**
   * Training pairs: each grouped ticket outside the fusion split, with its group's answer, at most
   * {@link #PAIRS_PER_GROUP} per group.
   */
  public static List<TrainingPair> rerankerPairs(Knowledge knowledge) {
    return rerankerPairs(knowledge, PAIRS_PER_GROUP);
  }

  /**
   * Training pairs as {@link #rerankerPairs(Knowledge)}, at most {@code perGroup} per answer group
   * (0: every ticket), chosen by {@link #capPerGroup}.
   */
  public static List<TrainingPair> rerankerPairs(Knowledge knowledge, int perGroup) {
    Map<String, String> groupOf = knowledge.grouping().groupOfTicket();
    Map<String, AnswerGroup> groups = knowledge.grouping().byId();
    List<String> ids = new ArrayList<>();
    for (Ticket t : knowledge.tickets().values()) {
      if (groupOf.get(t.id()) != null && !Splits.isFusionTicket(t.id())) {
        ids.add(t.id());
      }
    }
    java.util.Set<String> kept = new java.util.HashSet<>(capPerGroup(ids, groupOf, perGroup));
    List<TrainingPair> pairs = new ArrayList<>();
    for (Ticket t : knowledge.tickets().values()) {
      if (kept.contains(t.id())) {
        pairs.add(new TrainingPair(t.question(), groups.get(groupOf.get(t.id())).canonical()));
      }
    }
    return pairs;
  }

  /**
   * The tickets kept when each answer group gives at most {@code perGroup} (0: all of them): those
   * whose SHA-256 of the id comes first, so the choice is the same on every run, does not depend
   * on the tickets' order, and a group keeps its tickets when more are ingested unless a newcomer
   * sorts before them. Every group keeps min(size, perGroup) tickets. The hash is not the fusion
   * split's (CRC32), so the choice is independent of it.
   */
  static List<String> capPerGroup(List<String> ticketIds, Map<String, String> groupOf, int perGroup) {
    if (perGroup < 0) {
      throw new IllegalArgumentException("pairs per group must be 0 (all) or positive, was " + perGroup);
    }
    if (perGroup == 0) {
      return List.copyOf(ticketIds);
    }
    Map<String, List<String>> byGroup = new java.util.TreeMap<>();
    for (String id : ticketIds) {
      byGroup.computeIfAbsent(groupOf.get(id), g -> new ArrayList<>()).add(id);
    }
    List<String> kept = new ArrayList<>();
    for (List<String> members : byGroup.values()) {
      members.sort(java.util.Comparator.comparing(TeamModelTrainer::pairHash).thenComparing(id -> id));
      kept.addAll(members.subList(0, Math.min(perGroup, members.size())));
    }
    return kept;
  }

  private static String pairHash(String ticketId) {
    try {
      byte[] digest = java.security.MessageDigest.getInstance("SHA-256")
          .digest(ticketId.getBytes(java.nio.charset.StandardCharsets.UTF_8));
      return java.util.HexFormat.of().formatHex(digest);
    } catch (java.security.NoSuchAlgorithmException e) {
      throw new IllegalStateException("SHA-256 is missing from this Java runtime", e);
    }
  }

  /** The fusion split: every stored ticket kept apart from reranker training, one-offs too. */
  public static List<FusionQuestion> fusionQuestions(Knowledge knowledge) {
    Map<String, String> groupOf = knowledge.grouping().groupOfTicket();
    return knowledge.tickets().values().stream().filter(t -> Splits.isFusionTicket(t.id()))
        .map(t -> new FusionQuestion(t.id(), t.question(), groupOf.get(t.id()), true)).toList();
  }

  /**
   * The active model version, if it was trained on exactly the reranker pairs the knowledge gives
   * now, was finished (fusion fitted) and every file of it checks out: then training again would
   * change nothing.
   */
  public java.util.Optional<String> currentVersion(Knowledge knowledge) throws IOException {
    return currentVersion(knowledge, rerankerPairs(knowledge));
  }

  /**
   * As {@link #currentVersion(Knowledge)} for a model trained on {@code pairs} rather than the
   * knowledge's own split (a benchmark that keeps its own validation set apart).
   */
  public java.util.Optional<String> currentVersion(Knowledge knowledge, List<TrainingPair> pairs)
      throws IOException {
    ModelStore store = new ModelStore(dataDir.models());
    java.util.Optional<String> active = store.activeVersion();
    return active.isPresent() && current(knowledge, pairs, store, active.get())
        ? active : java.util.Optional.empty();
  }

  /**
   * The newest version, in force or not, of the kind asked for (with the reranker or without it)
   * that is current on the knowledge ({@link #currentVersion}): what a rerun finds already done.
   */
  public java.util.Optional<String> currentVersion(Knowledge knowledge, boolean withReranker)
      throws IOException {
    ModelStore store = new ModelStore(dataDir.models());
    List<TrainingPair> pairs = rerankerPairs(knowledge);
    List<String> versions = new ArrayList<>(store.versions());
    java.util.Collections.reverse(versions);
    for (String v : versions) {
      if (current(knowledge, pairs, store, v) && store.hasReranker(v) == withReranker) {
        return java.util.Optional.of(v);
      }
    }
    return java.util.Optional.empty();
  }

  private boolean current(Knowledge knowledge, List<TrainingPair> pairs, ModelStore store,
      String version)
      throws IOException {
    if (!java.nio.file.Files.exists(store.directory(version).resolve("fusion.json"))) {
      return false;
    }
    try {
      store.verify(version);
    } catch (org.precedent.engine.rerank.ModelLoadException e) {
      // Damaged, edited, or made by an earlier release: training again is the remedy.
      return false;
    }
    if (!denseMatches(knowledge, store.directory(version))) {
      return false;
    }
    String fingerprint = org.precedent.engine.rerank.train.DataFingerprint.of(pairs);
    return store.dataFingerprint(version).filter(fingerprint::equals).isPresent();
  }

  /**
   * Whether a version's dense leg fits the knowledge: none when it holds no vectors, else a
   * classifier fitted on vectors of the same encoder file.
   */
  private static boolean denseMatches(Knowledge knowledge, Path versionDir) throws IOException {
    Manifest.Vectors vectors = knowledge.manifest().vectors();
    AnswerClassifier classifier = AnswerClassifier.loadIfPresent(versionDir);
    return vectors == null ? classifier == null
        : classifier != null && vectors.sha256().equals(classifier.encoderSha256());
  }

  /**
   * Writes a version without the reranker: the dense leg's classifier (when the knowledge holds
   * question vectors) and fusion over the systems that need no reranker, fitted on the fusion
   * split. Minutes sooner than a full version (no network is trained), so that decisions can start
   * while the reranker trains. Active when no version is in force yet, else a candidate. Its
   * fingerprint is that of the reranker pairs the knowledge gives, the tickets the classifier
   * learns from, so that a rerun on the same tickets finds it done.
   */
  public TrainingReport trainWithoutReranker(Knowledge knowledge) throws IOException {
    List<TrainingPair> pairs = rerankerPairs(knowledge);
    List<FusionQuestion> fusion = fusionQuestions(knowledge);
    Fitted fitted = fitWithDenseLeg(knowledge, fusion, (retriever, dense) ->
        FusionFit.fitWithoutReranker(Assembly.candidatesWithoutReranker(retriever, dense), fusion));
    ModelStore store = new ModelStore(dataDir.models());
    String version = store.writeWithoutReranker(
        org.precedent.engine.rerank.train.DataFingerprint.of(pairs), fitted::writeInto);
    FusionFit fit = fitted.fit();
    boolean first = store.activeVersion().isEmpty();
    if (first) {
      store.activate(version);
    }
    return new TrainingReport(version, first, null, fit.summary());
  }

  /** Trains on the knowledge's own split ({@link Splits}). */
  public TrainingReport train(Knowledge knowledge, boolean resume) throws IOException {
    return train(knowledge, rerankerPairs(knowledge), fusionQuestions(knowledge), resume);
  }

  /**
   * Trains the reranker on {@code pairs}, fits fusion on {@code fusion} and writes a version,
   * active when no version is in force yet, else a candidate ({@link TrainingReport#activated}).
   */
  public TrainingReport train(Knowledge knowledge, List<TrainingPair> pairs,
      List<FusionQuestion> fusion, boolean resume) throws IOException {
    if (pairs.size() < 20) {
      throw new IllegalStateException("only " + pairs.size() + " tickets with a reused answer to "
          + "train on; ingest more resolved tickets first");
    }
    Path work = dataDir.models().resolve("training");
    RerankerTrainer trainer = new RerankerTrainer(config, work);
    TrainedReranker trained = resume ? trainer.resume(pairs) : trainer.train(pairs);
    Fitted fitted = fitWithDenseLeg(knowledge, fusion, (retriever, dense) -> FusionFit.fit(
        Assembly.candidates(retriever, new Scorer(trained.model(), 1), dense), fusion));
    // Fusion and the classifier are written with the version, so that its manifest covers them.
    ModelStore store = new ModelStore(dataDir.models());
    String version = store.write(trained, fitted::writeInto);
    FusionFit fit = fitted.fit();
    // A version in force was measured and chosen: a new one earns its place by comparison
    // (evaluate, then an activation that shows it); only the first one goes in force at once.
    boolean first = store.activeVersion().isEmpty();
    if (first) {
      store.activate(version);
    }
    return new TrainingReport(version, first, trained.metrics(), fit.summary());
  }

  /** Fits fusion over the index and, when the knowledge holds question vectors, the dense leg. */
  private interface FusionFitter {
    FusionFit fit(Retriever retriever, DenseLeg dense);
  }

  /** A fitted fusion and the dense leg's classifier it learnt with (null without vectors). */
  private record Fitted(FusionFit fit, AnswerClassifier classifier) {
    void writeInto(Path versionDir) throws IOException {
      fit.save(versionDir);
      if (classifier != null) {
        classifier.save(versionDir);
      }
    }
  }

  /** The dense leg's classifier, when there are vectors, then fusion fitted with it. */
  private static Fitted fitWithDenseLeg(Knowledge knowledge, List<FusionQuestion> fusion,
      FusionFitter fitter)
      throws IOException {
    AnswerClassifier classifier = null;
    try (Retriever retriever = Retriever.open(knowledge)) {
      Manifest.Vectors vectors = knowledge.manifest().vectors();
      if (vectors != null && retriever.hasVectors()) {
        classifier = fitClassifier(knowledge, vectors, retriever.storedVectors(), fusion);
      }
      try (DenseLeg dense = classifier == null ? null : DenseLeg.open(vectors, classifier)) {
        return new Fitted(fitter.fit(retriever, dense), classifier);
      }
    }
  }

  /**
   * The dense leg's classifier, fitted on every grouped stored ticket that fusion does not ask
   * (with the knowledge's own split, the reranker's tickets), so that fusion sees its probabilities
   * on questions it was not fitted on, as a decision will. Fusion questions from outside the
   * knowledge (a benchmark's validation set) leave every stored ticket to the classifier.
   */
  static AnswerClassifier fitClassifier(Knowledge knowledge, Manifest.Vectors encoder,
      Map<String, QuestionVectors.Stored> stored, List<FusionQuestion> fusion) {
    Map<String, String> groupOf = knowledge.grouping().groupOfTicket();
    java.util.Set<String> asked = new java.util.HashSet<>();
    fusion.stream().filter(FusionQuestion::stored).forEach(q -> asked.add(q.ticketId()));
    List<float[]> vectors = new ArrayList<>();
    List<String> labels = new ArrayList<>();
    stored.forEach((ticket, v) -> {
      String group = groupOf.get(ticket);
      if (group != null && !asked.contains(ticket)) {
        vectors.add(v.vector());
        labels.add(group);
      }
    });
    System.err.printf(java.util.Locale.ROOT, "fitting the answer classifier on %,d question "
        + "vectors of %s%n", vectors.size(), encoder.encoder());
    return AnswerClassifier.fit(encoder.encoder(), encoder.sha256(), vectors, labels,
        AnswerClassifier.LAMBDA, new org.precedent.knowledge.io.Progress(
            "fitting the answer classifier", "steps", System.err));
  }
}
