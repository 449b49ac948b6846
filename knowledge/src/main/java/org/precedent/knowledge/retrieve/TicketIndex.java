package org.precedent.knowledge.retrieve;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Collection;
import java.util.Map;
import org.apache.lucene.analysis.Analyzer;
import org.apache.lucene.document.Document;
import org.apache.lucene.document.Field;
import org.apache.lucene.document.KnnFloatVectorField;
import org.apache.lucene.document.StoredField;
import org.apache.lucene.document.StringField;
import org.apache.lucene.document.TextField;
import org.apache.lucene.index.IndexWriter;
import org.apache.lucene.index.IndexWriterConfig;
import org.apache.lucene.index.VectorSimilarityFunction;
import org.apache.lucene.search.similarities.BM25Similarity;
import org.apache.lucene.store.FSDirectory;
import org.precedent.knowledge.embed.QuestionVectors;
import org.precedent.knowledge.embed.SentenceEncoder;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.store.Knowledge;
import org.precedent.knowledge.store.Manifest;
import org.precedent.knowledge.ticket.Ticket;

/**
 * The Lucene index of past questions.
 *
 * <p>Fields, and why:
 * <ul>
 *   <li>{@code question}: the cleaned question, analysed for English by {@link QuestionAnalyzer}
 *       (standard tokenizer, possessive removal, lower case, English stop words, Porter stemming)
 *       so that "bills", "billed" and "billing" meet, with redaction placeholders left out; stored,
 *       to show and highlight evidence. Only questions are searched: a new
 *       question is worded like past questions, not like the agents' answers.</li>
 *   <li>{@code id}, {@code group}, {@code category}: exact keywords, stored, not scored; {@code group}
 *       is empty for one-off tickets, which are shown as references but never proposed.</li>
 *   <li>{@code vector}: the question's unit vector from a sentence encoder, when the generation has
 *       a dense leg, in Lucene's HNSW graph; compared by dot product, which for unit vectors is
 *       the cosine.</li>
 * </ul>
 * Scoring is BM25 with k1 = 1.2 and b = 0.75 (Robertson and Zaragoza 2009, "The Probabilistic
 * Relevance Framework: BM25 and Beyond"; the values are Lucene's defaults and the usual ones).
 */
public final class TicketIndex {
  public static final float K1 = 1.2f;
  public static final float B = 0.75f;

  static final String ID = "id";
  static final String QUESTION = "question";
  static final String GROUP = "group";
  static final String CATEGORY = "category";
  static final String VECTOR = "vector";

  private TicketIndex() {}

  static Analyzer analyzer() {
    return new QuestionAnalyzer();
  }

  static BM25Similarity similarity() {
    return new BM25Similarity(K1, B);
  }

  /** What the store calls to write a new generation's index without vectors (BM25 only). */
  public static Knowledge.IndexBuilder builder(Progress progress) {
    return (dir, tickets, grouping) -> {
      build(dir, tickets, grouping.groupOfTicket(), Map.of(), progress);
      return null;
    };
  }

  /**
   * What the store calls to write a new generation's index with the questions' vectors by {@code
   * encoder}: those {@code previous} holds for the same question are taken over, the rest embedded
   * with {@code embedding} progress.
   *
   * @param previous the previous generation's vectors by ticket id, made by this same encoder
   */
  public static Knowledge.IndexBuilder builder(Progress indexing, Progress embedding,
      SentenceEncoder encoder, Map<String, QuestionVectors.Stored> previous) {
    return (dir, tickets, grouping) -> {
      Map<String, float[]> vectors = QuestionVectors.of(tickets, encoder, previous, embedding);
      build(dir, tickets, grouping.groupOfTicket(), vectors, indexing);
      SentenceEncoder.Identity id = encoder.identity();
      return new Manifest.Vectors(id.model(), id.sha256(), id.dimension());
    };
  }

  /**
   * Writes a new index of {@code tickets} into the empty directory {@code dir}.
   *
   * @param groupOfTicket answer group id by ticket id; tickets not in it are one-offs
   * @param vectors       the questions' unit vectors by ticket id, all of one length, or none
   */
  public static void build(Path dir, Collection<Ticket> tickets, Map<String, String> groupOfTicket,
      Map<String, float[]> vectors, Progress progress) throws IOException {
    IndexWriterConfig config = new IndexWriterConfig(analyzer())
        .setSimilarity(similarity())
        .setOpenMode(IndexWriterConfig.OpenMode.CREATE)
        .setRAMBufferSizeMB(64);
    try (FSDirectory directory = FSDirectory.open(dir);
        IndexWriter writer = new IndexWriter(directory, config)) {
      long done = 0;
      progress.total(tickets.size());
      for (Ticket ticket : tickets) {
        Document doc = new Document();
        doc.add(new StringField(ID, ticket.id(), Field.Store.YES));
        doc.add(new TextField(QUESTION, ticket.question(), Field.Store.YES));
        doc.add(new StringField(GROUP, groupOfTicket.getOrDefault(ticket.id(), ""), Field.Store.YES));
        if (ticket.category() != null) {
          doc.add(new StoredField(CATEGORY, ticket.category()));
        }
        float[] vector = vectors.get(ticket.id());
        if (vector != null) {
          doc.add(new KnnFloatVectorField(VECTOR, vector, VectorSimilarityFunction.DOT_PRODUCT));
        } else if (!vectors.isEmpty()) {
          throw new IllegalArgumentException("ticket " + ticket.id() + " has no vector");
        }
        writer.addDocument(doc);
        progress.update(++done);
      }
      writer.forceMerge(1);
      writer.commit();
      progress.finish(done);
    }
  }
}
