package org.precedent.engine.decide;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.engine.stats.LogisticModel;
import org.precedent.engine.stats.PlattCalibrator;
import org.precedent.engine.explain.Explanation;
import org.precedent.engine.fusion.FusionModel;
import org.precedent.engine.fusion.ScoringSystem;
import org.precedent.engine.fusion.SystemModel;
import org.precedent.engine.rerank.Scorer;
import org.precedent.engine.rerank.TinyModel;
import org.precedent.engine.safety.SafetyPolicy;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.ingest.ColumnMapping;
import org.precedent.knowledge.ingest.ExportFormat;
import org.precedent.knowledge.ingest.Ingestor;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.retrieve.Retriever;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;

/**
 * The reply-or-hand-off rules, on real parts: a Lucene index of a few labelled tickets, a small
 * trained reranker, and a fusion model whose weights are set by hand so that the confidence of the
 * best candidate is known: only the BM25 inverse rank counts, with weight 2, and the Platt map is the
 * plain logistic function, so the top candidate's confidence is 1 / (1 + e^-2) = 0.881.
 */
class PipelineTest {
  @TempDir
  static Path tmp;

  static Retriever retriever;
  static Retriever callBack;
  static Retriever callBackDeclared;
  static Scorer scorer;
  static FusionModel fusion;
  static final double TOP_CONFIDENCE = 1 / (1 + Math.exp(-2));

  @BeforeAll
  static void setUp() throws Exception {
    Path csv = Files.writeString(tmp.resolve("tickets.csv"), """
        text,label,category
        my bin was not emptied this week,missed_bin,bins
        the crew missed my bin again,missed_bin,bins
        how do I send a meter reading,meter_reading,meters
        where do I give you my meter reading,meter_reading,meters
        I want to make a formal complaint about your staff,complaint_ack,complaint
        """);
    DataDir data = new DataDir(tmp.resolve("data"));
    new Ingestor(data, TextCleaner.standard(), AnswerGrouper.standard()).ingest(csv,
        ExportFormat.CSV, ColumnMapping.of(Map.of("question", "text", "label", "label",
            "category", "category")), Progress.silent(), Progress.silent());
    retriever = Retriever.open(Knowledge.open(data).orElseThrow());
    callBack = ingestCallBackAnswers(tmp.resolve("call-back"), false);
    callBackDeclared = ingestCallBackAnswers(tmp.resolve("call-back-declared"), true);
    scorer = new Scorer(TinyModel.get().model());
    List<SystemModel> systems = Arrays.stream(ScoringSystem.values()).filter(s -> s.applies(false)).map(s -> {
      double[] weights = new double[s.features(false).size()];
      int inverseRank = s.features(false).indexOf("bm25_inverse_rank");
      if (inverseRank >= 0) {
        weights[inverseRank] = 2;
      }
      double[] zero = new double[weights.length];
      double[] one = new double[weights.length];
      Arrays.fill(one, 1);
      return new SystemModel(s, new LogisticModel(s.features(false), zero, one, weights, 0, 0),
          new PlattCalibrator(-1, 0));
    }).toList();
    fusion = new FusionModel(systems, Map.of());
  }

  @AfterAll
  static void tearDown() throws Exception {
    retriever.close();
    callBack.close();
    callBackDeclared.close();
  }

  /**
   * Three past replies that give the desk's number (from Ofcom's range reserved for drama, so no
   * one's): redacted unless the data directory declares it as the desk's own.
   */
  private static Retriever ingestCallBackAnswers(Path dir, boolean declared) throws Exception {
    DataDir data = new DataDir(dir);
    if (declared) {
      Files.createDirectories(dir);
      Files.writeString(data.ownDetails(), "phone 01632 960999\n");
    }
    Path csv = Files.writeString(dir.resolveSibling(dir.getFileName() + ".csv"), """
        id,question,reply
        1,no water at all this morning,Please call our 24-hour line on 01632 960999.
        2,there is no water from my taps,Please call our 24-hour line on 01632 960999.
        3,no water in the house since six,Please call our 24-hour line on 01632 960999.
        """);
    Ingestor.of(data, AnswerGrouper.standard()).ingest(csv, ExportFormat.CSV,
        ColumnMapping.of(Map.of("id", "id", "question", "question", "reply", "reply")),
        Progress.silent(), Progress.silent());
    return Retriever.open(Knowledge.open(data).orElseThrow());
  }

  private Decision decide(String question, String category, Thresholds thresholds,
      SafetyPolicy policy) {
    return Assembly.pipeline(retriever, scorer, fusion, policy, thresholds)
        .decide(question, category);
  }

  @Test
  void repliesWithTheCanonicalAnswerAtOrAboveTheThreshold() {
    Decision d = decide("Hi, my bin was not emptied", null, Thresholds.global(0.8),
        SafetyPolicy.defaults());
    assertEquals(Outcome.REPLY, d.outcome());
    assertNull(d.reason());
    assertEquals("missed_bin", d.answerGroup());
    assertEquals("missed bin", d.reply());
    assertEquals(TOP_CONFIDENCE, d.confidence(), 1e-9);
    assertTrue(d.explanation().contains("0.80"), d.explanation());
  }

  @Test
  void handsOffBelowTheThresholdAndObeysCategoryThresholds() {
    Decision global = decide("my bin was not emptied", null, Thresholds.global(0.9),
        SafetyPolicy.defaults());
    assertEquals(Outcome.HAND_OFF, global.outcome());
    assertEquals(HandOffReason.BELOW_THRESHOLD, global.reason());
    assertNull(global.reply());
    Thresholds perCategory = new Thresholds(0.9, Map.of("bins", 0.5));
    assertEquals(Outcome.REPLY,
        decide("my bin was not emptied", "bins", perCategory, SafetyPolicy.defaults()).outcome());
  }

  @Test
  void theExplanationWritesTheThresholdExactlyAndNeverAConfidenceAboveIt() {
    // The top confidence is 1 / (1 + e^-2) = 0.8807971 (see the class comment).
    Decision below = decide("my bin was not emptied", null, Thresholds.global(0.881),
        SafetyPolicy.defaults());
    assertEquals(HandOffReason.BELOW_THRESHOLD, below.reason());
    assertTrue(below.explanation().contains("confidence 0.880, below the threshold 0.881"),
        below.explanation());
    Decision justBelow = decide("my bin was not emptied", null, Thresholds.global(0.8808),
        SafetyPolicy.defaults());
    assertTrue(justBelow.explanation().contains("confidence 0.8807, below the threshold 0.8808"),
        justBelow.explanation());
    Decision justAbove = decide("my bin was not emptied", null, Thresholds.global(0.8805),
        SafetyPolicy.defaults());
    assertEquals(Outcome.REPLY, justAbove.outcome());
    assertTrue(justAbove.explanation().contains("confidence 0.8807, at or above the threshold "
        + "0.8805"), justAbove.explanation());
  }

  @Test
  void aSafetyQuestionIsHandedOffWithItsCautionWhateverTheConfidence() {
    Decision d = decide("the water from my tap is brown, my bin was not emptied", null,
        Thresholds.global(0.0), SafetyPolicy.defaults());
    assertEquals(Outcome.HAND_OFF, d.outcome());
    assertEquals(HandOffReason.SAFETY_RULE, d.reason());
    assertNotNull(d.safety());
    assertEquals("water-quality", d.safety().topic());
    assertTrue(d.caution().contains("public-health"), d.caution());
    assertNull(d.reply(), "no automatic reply is ever given for a safety case");
  }

  @Test
  void theExplanationNamesEveryMatchingSafetyTopicTheMostSpecificFirst() {
    // The sewage question also has the smell of bad water in it: the sewage topic leads, and the
    // water-quality one is named after it, as the caution lists them.
    Decision d = decide("Sewage coming up through the drain in my garden and it smells awful",
        null, Thresholds.global(0.0), SafetyPolicy.defaults());
    assertEquals(HandOffReason.SAFETY_RULE, d.reason());
    List<String> topics = d.safety().topics();
    assertTrue(topics.size() >= 2, topics.toString());
    assertTrue(d.explanation().contains("(" + topics.get(0) + "; also "), d.explanation());
    for (String topic : topics) {
      assertTrue(d.explanation().contains(topic), topic + " in " + d.explanation());
    }
  }

  @Test
  void humanOnlyCategoriesAndAnswersAreHandedOff(@TempDir Path dir) throws Exception {
    SafetyPolicy policy = SafetyPolicy.load(Files.writeString(dir.resolve("team.rules"),
        "human-only-category = complaint\n"));
    Decision byAnswer = decide("formal complaint about your staff", null, Thresholds.global(0),
        policy);
    assertEquals(HandOffReason.HUMAN_ONLY, byAnswer.reason(), byAnswer.explanation());
    Decision byTicket = decide("my bin was not emptied", "complaint", Thresholds.global(0), policy);
    assertEquals(HandOffReason.HUMAN_ONLY, byTicket.reason());
    Decision byGroup = decide("how do I send a meter reading", null, Thresholds.global(0),
        policy.withHumanOnlyGroups(java.util.Set.of("meter_reading")));
    assertEquals(HandOffReason.HUMAN_ONLY, byGroup.reason());
  }

  @Test
  void aQuestionSharingNoWordWithThePastHasNoCandidate() {
    Decision d = decide("xylophone quartz", null, Thresholds.global(0), SafetyPolicy.defaults());
    assertEquals(HandOffReason.NO_CANDIDATE, d.reason());
    assertEquals(0, d.confidence());
    assertTrue(d.candidates().isEmpty());
  }

  @Test
  void anAnswerLackingARedactedDetailIsHandedOffWhateverTheConfidence() {
    Decision d = Assembly.pipeline(callBack, scorer, fusion, SafetyPolicy.defaults(),
        Thresholds.global(0)).decide("no water at all today", null);
    assertEquals(Outcome.HAND_OFF, d.outcome());
    assertEquals(HandOffReason.ANSWER_INCOMPLETE, d.reason());
    assertNull(d.reply());
    assertTrue(d.explanation().contains("[PHONE]"), d.explanation());
  }

  @Test
  void anAnswerWithSlotsForTheCustomersDetailsIsHandedOffWhateverTheConfidence(@TempDir Path dir)
      throws Exception {
    // Invented replies of a council desk: the same answer, each with the customer's own day.
    DataDir data = new DataDir(dir.resolve("bins"));
    Path csv = Files.writeString(dir.resolve("bins.csv"), """
        id,question,reply
        1,what day are my bins collected,Your garden waste is collected every other week on Tuesday from April to November so put the brown bin out by 7am.
        2,which day is bin collection,Your garden waste is collected every other week on Friday from April to November so put the brown bin out by 7am.
        3,when do the bins get collected,Your garden waste is collected every other week on Monday from April to November so put the brown bin out by 7am.
        """);
    Ingestor.of(data, AnswerGrouper.standard()).ingest(csv, ExportFormat.CSV,
        ColumnMapping.of(Map.of("id", "id", "question", "question", "reply", "reply")),
        Progress.silent(), Progress.silent());
    try (Retriever bins = Retriever.open(Knowledge.open(data).orElseThrow())) {
      Decision d = Assembly.pipeline(bins, scorer, fusion, SafetyPolicy.defaults(),
          Thresholds.global(0)).decide("what day are my bins collected", null);
      assertEquals(Outcome.HAND_OFF, d.outcome());
      assertEquals(HandOffReason.NEEDS_CUSTOMER_DETAILS, d.reason(), d.explanation());
      assertNull(d.reply());
      assertTrue(d.explanation().contains("on ⟦slot:day⟧ from April"), d.explanation());
    }
  }

  @Test
  void theDesksDeclaredNumberStaysInTheAnswerSoItCanBeSent() {
    Decision d = Assembly.pipeline(callBackDeclared, scorer, fusion,
        SafetyPolicy.defaults(), Thresholds.global(0)).decide("no water at all today", null);
    assertEquals(Outcome.REPLY, d.outcome(), d.explanation());
    assertEquals("Please call our 24-hour line on 01632 960999.", d.reply());
  }

  @Test
  void theExplanationIsATreeWhoseNumbersRecomputeTheConfidence() {
    Decision d = decide("Hi, my bin was not emptied", null, Thresholds.global(0.8),
        SafetyPolicy.defaults());
    Explanation why = d.why();
    assertEquals(d.explanation(), why.detail(), "the sentence is the tree's root");
    assertEquals("reply", why.name());
    Explanation confidence = why.find("confidence").orElseThrow();
    Explanation logit = confidence.find("logit").orElseThrow();
    // The test's fusion puts weight 2 on BM25's inverse rank (mean 0, sd 1) and nothing else, so
    // the top candidate's logit is 2 and its largest term that feature's.
    assertEquals(2.0, logit.value(), 1e-12);
    assertEquals("bm25_inverse_rank", logit.parts().get(0).name());
    assertEquals(logit.value(), logit.parts().stream().mapToDouble(Explanation::value).sum(),
        1e-12);
    // Platt (1999): P = 1 / (1 + exp(A f + B)), here A = -1, B = 0.
    assertEquals(1 / (1 + Math.exp(-1 * logit.value() + 0)), confidence.value(), 1e-12);
    assertEquals(d.confidence(), confidence.value(), 1e-12);
    assertEquals(0.8, why.find("threshold").orElseThrow().value(), 0);
  }

  @Test
  void aSafetyHandOffNamesItsRuleFirstInTheTree() {
    Decision d = decide("the water from my tap is brown", null, Thresholds.global(0),
        SafetyPolicy.defaults());
    assertEquals("hand off: safety rule", d.why().name());
    assertEquals("safety rule", d.why().parts().get(0).name());
    assertTrue(d.why().parts().get(0).detail().contains("water-quality"),
        d.why().parts().get(0).detail());
  }
}
