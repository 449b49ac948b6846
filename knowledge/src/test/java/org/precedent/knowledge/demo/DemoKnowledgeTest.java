package org.precedent.knowledge.demo;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Function;
import java.util.stream.Collectors;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.group.AnswerGroup;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.ingest.ColumnMapping;
import org.precedent.knowledge.ingest.ExportFormat;
import org.precedent.knowledge.ingest.IngestReport;
import org.precedent.knowledge.ingest.Ingestor;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.retrieve.Aggregation;
import org.precedent.knowledge.retrieve.CandidateRecall;
import org.precedent.knowledge.retrieve.Retriever;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;
import org.precedent.knowledge.testdata.DemoData;
import org.precedent.knowledge.ticket.Ticket;

/**
 * Answer grouping and BM25 recall on the demo help desk, judged against the generator's answer key
 * (which ingest never reads). The demo data is invented; these tests show the stated grouping
 * threshold at work on it and guard the recall that any reranker is bounded by.
 */
class DemoKnowledgeTest {
  @TempDir
  static Path tmp;

  static Knowledge knowledge;
  static Retriever retriever;
  static Map<String, String> trainKeys;
  static Map<String, String> heldOutKeys;
  static Ingestor.ParsedExport heldOut;
  static IngestReport report;

  @BeforeAll
  static void ingestDemo() throws Exception {
    Path dir = DemoData.dir();
    ColumnMapping mapping = ColumnMapping.fromFile(dir.resolve("mapping.properties"), Map.of());
    DataDir data = new DataDir(tmp.resolve("data"));
    Ingestor ingestor = new Ingestor(data, TextCleaner.standard(), AnswerGrouper.standard());
    report = ingestor.ingest(dir.resolve("tickets.csv"), ExportFormat.CSV, mapping,
        Progress.silent(), Progress.silent());
    heldOut = ingestor.parse(dir.resolve("heldout.csv"), ExportFormat.CSV, mapping,
        Progress.silent());
    knowledge = Knowledge.open(data).orElseThrow();
    retriever = Retriever.open(knowledge);
    trainKeys = DemoData.answerKeys(dir.resolve("tickets.csv"));
    heldOutKeys = DemoData.answerKeys(dir.resolve("heldout.csv"));
  }

  @AfterAll
  static void closeIndex() throws Exception {
    retriever.close();
  }

  /** The answer key most of a group's tickets carry. */
  private static String majorityKey(AnswerGroup g) {
    return g.ticketIds().stream().collect(Collectors.groupingBy(trainKeys::get, Collectors.counting()))
        .entrySet().stream().max(Map.Entry.comparingByValue()).orElseThrow().getKey();
  }

  @Test
  void groupsRecoverTheReusedAnswersAndKeepOneOffsApart() {
    List<AnswerGroup> groups = knowledge.grouping().groups();
    long reusable = trainKeys.values().stream().filter(k -> !DemoData.isOneOff(k)).distinct().count();
    int agreeing = 0;
    Map<String, Integer> groupsPerKey = new HashMap<>();
    for (AnswerGroup g : groups) {
      String key = majorityKey(g);
      agreeing += (int) g.ticketIds().stream().filter(t -> trainKeys.get(t).equals(key)).count();
      groupsPerKey.merge(key, 1, Integer::sum);
    }
    int grouped = groups.stream().mapToInt(AnswerGroup::size).sum();
    double purity = agreeing / (double) grouped;
    long oneOffsKept = knowledge.grouping().oneOffs().stream()
        .filter(t -> DemoData.isOneOff(trainKeys.get(t))).count();
    long oneOffs = trainKeys.values().stream().filter(DemoData::isOneOff).count();
    long reusableGrouped = trainKeys.entrySet().stream()
        .filter(e -> !DemoData.isOneOff(e.getValue()))
        .filter(e -> knowledge.grouping().groupOfTicket().containsKey(e.getKey())).count();
    long reusableTickets = trainKeys.values().stream().filter(k -> !DemoData.isOneOff(k)).count();
    System.out.printf("demo grouping: %d groups for %d reused answers; purity %.4f; "
            + "reused-answer tickets grouped %.4f; one-offs kept apart %d of %d; "
            + "answers split over several groups %d%n", groups.size(), reusable, purity,
        reusableGrouped / (double) reusableTickets, oneOffsKept, oneOffs,
        groupsPerKey.values().stream().filter(n -> n > 1).count());
    assertTrue(purity >= 0.99, "purity " + purity);
    assertTrue(reusableGrouped >= 0.98 * reusableTickets, "grouped " + reusableGrouped);
    // A few of the generator's one-off replies repeat a stock paragraph word for word; grouping
    // them is right by the reply text, so the floor is 97%, not all.
    assertTrue(oneOffsKept >= 0.97 * oneOffs, "one-offs kept apart: " + oneOffsKept);
    assertTrue(groups.size() <= reusable + 5, groups.size() + " groups");
  }

  @Test
  void heldOutRecallMeetsItsFloors() {
    Map<String, String> groupOfKey = knowledge.grouping().groups().stream()
        .collect(Collectors.toMap(DemoKnowledgeTest::majorityKey, AnswerGroup::id, (a, b) -> a));
    List<CandidateRecall.Case> cases = new ArrayList<>();
    for (Ticket t : heldOut.tickets()) {
      String group = groupOfKey.get(heldOutKeys.get(t.id()));
      if (group != null) {
        cases.add(new CandidateRecall.Case(t.question(), group));
      }
    }
    for (Aggregation a : Aggregation.values()) {
      System.out.println("demo held-out (" + cases.size() + " answerable), BM25 " + a
          + " recall@k: " + CandidateRecall.measure(retriever, cases, a));
    }
    Map<Integer, Double> recall = CandidateRecall.measure(retriever, cases,
        Aggregation.MAX_PLUS_SUPPORT);
    assertTrue(cases.size() >= 500, "answerable held-out tickets: " + cases.size());
    // Measured 0.924 / 0.980 / 0.987 / 0.995 at k = 1, 5, 10, 20 (DEVELOPERS.md); floors a few
    // points lower so that noise passes and a real loss fails.
    assertTrue(recall.get(1) >= 0.88, "recall@1 " + recall);
    assertTrue(recall.get(5) >= 0.95, "recall@5 " + recall);
    assertTrue(recall.get(10) >= 0.96, "recall@10 " + recall);
    assertTrue(recall.get(20) >= 0.97, "recall@20 " + recall);
  }

  @Test
  void heldOutRepliesMatchTheGroupOfTheirAnswer() {
    Map<String, String> groupOfKey = knowledge.grouping().groups().stream()
        .collect(Collectors.toMap(DemoKnowledgeTest::majorityKey, AnswerGroup::id, (a, b) -> a));
    var replyMatcher = AnswerGrouper.standard().matcher(knowledge.grouping());
    int right = 0;
    int total = 0;
    for (Ticket t : heldOut.tickets()) {
      String expected = groupOfKey.get(heldOutKeys.get(t.id()));
      String matched = replyMatcher.apply(t.reply()).map(AnswerGroup::id).orElse(null);
      total++;
      if (java.util.Objects.equals(expected, matched)) {
        right++;
      }
    }
    System.out.printf("held-out reply matching agrees with the answer key on %d of %d%n", right,
        total);
    assertTrue(right >= 0.97 * total, right + " of " + total);
  }

  @Test
  void ingestProposesTheDesksOwnNumberAndNoCustomersNumber() {
    // The demo's own-details.txt declares the desk's number; this ingest did not read it, so the
    // number was redacted and ingest proposes it. Customers' numbers each sit in one ticket.
    List<String> proposed = report.proposedOwnDetails().stream()
        .map(IngestReport.ProposedDetail::value).toList();
    assertEquals(List.of("01632 960999"), proposed);
  }

  @Test
  void slotsOnTheDemoDataKeepOtherCustomersDetailsOutOfAutomaticReplies() {
    List<AnswerGroup> groups = knowledge.grouping().groups();
    Map<String, AnswerGroup> byId = groups.stream()
        .collect(Collectors.toMap(AnswerGroup::id, Function.identity()));
    Map<String, Ticket> tickets = knowledge.tickets();
    Map<String, List<String>> replies = new HashMap<>();
    for (AnswerGroup g : groups) {
      replies.put(g.id(), g.ticketIds().stream().map(id -> tickets.get(id).reply()).toList());
    }
    long templates = groups.stream().filter(g -> g.template() != null).count();
    groups.stream().filter(g -> g.template() != null).forEach(g -> System.out.printf(
        "slots benchmark: template of %s (%d replies): %s%n", g.id(), g.size(), g.template()));
    long slots = groups.stream().mapToLong(g -> org.precedent.knowledge.group.Slots
        .names(g.template()).size()).sum();
    int before = 0;
    int after = 0;
    for (Ticket t : heldOut.tickets()) {
      var candidates = retriever.retrieve(t.question(),
          org.precedent.knowledge.retrieve.RetrievalSettings.standard()).candidates();
      if (candidates.isEmpty()) {
        continue;
      }
      AnswerGroup best = byId.get(candidates.get(0).group().id());
      if (org.precedent.knowledge.group.Slots.wouldSendAnothersDetail(best.canonical(),
          replies.get(best.id()), t.reply())) {
        before++;
        if (best.template() == null) {
          after++; // a template is never sent as it stands, so only an untemplated group counts
        }
      }
    }
    System.out.printf("slots benchmark: %d of %d groups are templates, %d slots; held-out tickets"
        + " whose best answer holds another customer's detail: %d before, %d after%n",
        templates, groups.size(), slots, before, after);
    assertEquals(0, after);
  }
}
