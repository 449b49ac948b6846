package org.precedent.engine.fusion;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.engine.candidates.Bm25Candidates;
import org.precedent.engine.candidates.CandidateSource;
import org.precedent.engine.candidates.CandidateStages;
import org.precedent.engine.candidates.RerankerScores;
import org.precedent.engine.learn.Splits;
import org.precedent.engine.learn.TeamModelTrainer;
import org.precedent.engine.rerank.Scorer;
import org.precedent.engine.rerank.TinyModel;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.ingest.ColumnMapping;
import org.precedent.knowledge.ingest.ExportFormat;
import org.precedent.knowledge.ingest.Ingestor;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.retrieve.Evidence;
import org.precedent.knowledge.retrieve.Retrieval;
import org.precedent.knowledge.retrieve.Retriever;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;

/**
 * Fusion is fitted on questions asked as new ones: a stored ticket of the fusion split must never
 * find itself in retrieval, or fusion would learn from answers that cannot be wrong. The check
 * watches every retrieval the fit makes through the real BM25 index.
 */
class FusionSplitTest {
  @TempDir
  Path tmp;

  @Test
  void noFusionTicketIsAskedWithItselfInRetrieval() throws Exception {
    // Each question twice under different ids: the question's own ticket would always be the
    // best match if it were not left out.
    StringBuilder csv = new StringBuilder("id,text,label\n");
    // The intents share words, so other answers are candidates too, and every seventh ticket is
    // filed under the next intent, so that the top candidate is sometimes wrong.
    String[][] intents = {{"missed_bin", "my bin was not emptied on day %d"},
        {"meter_reading", "my meter was not read on day %d"},
        {"leak", "my leak was not fixed on day %d"}};
    for (int i = 0; i < 150; i++) {
      String[] intent = intents[i % intents.length];
      String label = i % 7 == 0 ? intents[(i + 1) % intents.length][0] : intent[0];
      csv.append("t").append(i).append(',').append(intent[1].formatted(i)).append(',')
          .append(label).append('\n');
    }
    Path file = Files.writeString(tmp.resolve("tickets.csv"), csv);
    DataDir data = new DataDir(tmp.resolve("data"));
    new Ingestor(data, TextCleaner.standard(), AnswerGrouper.standard()).ingest(file,
        ExportFormat.CSV, ColumnMapping.of(Map.of("id", "id", "question", "text", "label", "label")),
        Progress.silent(), Progress.silent());
    Knowledge knowledge = Knowledge.open(data).orElseThrow();
    try (Retriever retriever = Retriever.open(knowledge)) {
      List<FusionQuestion> questions = TeamModelTrainer.fusionQuestions(knowledge);
      assertFalse(questions.isEmpty(), "the split holds some of 150 tickets");
      assertTrue(questions.stream().allMatch(q -> Splits.isFusionTicket(q.ticketId())));
      List<String[]> asked = new ArrayList<>();
      CandidateSource bm25 = new Bm25Candidates(retriever);
      CandidateSource watched = (question, excluded) -> {
        Retrieval r = bm25.retrieve(question, excluded);
        Stream.concat(r.candidates().stream().flatMap(c -> c.evidence().stream()),
            r.references().stream()).map(Evidence::ticketId)
            .forEach(id -> asked.add(new String[] {question, id}));
        return r;
      };
      FusionFit.fit(new CandidateStages(watched,
          new RerankerScores(new Scorer(TinyModel.get().model()))), questions);
      for (FusionQuestion q : questions) {
        long seen = asked.stream().filter(a -> a[0].equals(q.question())).count();
        assertTrue(seen > 0, q.ticketId() + " was asked and found its twin");
        assertTrue(asked.stream().noneMatch(a -> a[0].equals(q.question())
            && a[1].equals(q.ticketId())), q.ticketId() + " found itself");
      }
      assertEquals(questions.size(), asked.stream().map(a -> a[0]).distinct().count());
    }
  }
}
