package org.precedent.knowledge.retrieve;

import java.io.Closeable;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.apache.lucene.analysis.Analyzer;
import org.apache.lucene.analysis.TokenStream;
import org.apache.lucene.analysis.tokenattributes.CharTermAttribute;
import org.apache.lucene.analysis.tokenattributes.OffsetAttribute;
import org.apache.lucene.document.Document;
import org.apache.lucene.index.DirectoryReader;
import org.apache.lucene.index.FloatVectorValues;
import org.apache.lucene.index.LeafReaderContext;
import org.apache.lucene.index.StoredFields;
import org.apache.lucene.index.Term;
import org.apache.lucene.search.BooleanClause;
import org.apache.lucene.search.BooleanQuery;
import org.apache.lucene.search.DocIdSetIterator;
import org.apache.lucene.search.IndexSearcher;
import org.apache.lucene.search.KnnFloatVectorQuery;
import org.apache.lucene.search.MatchAllDocsQuery;
import org.apache.lucene.search.Query;
import org.apache.lucene.search.ScoreDoc;
import org.apache.lucene.search.TermQuery;
import org.apache.lucene.store.FSDirectory;
import org.precedent.knowledge.embed.QuestionVectors;
import org.precedent.knowledge.group.AnswerGroup;
import org.precedent.knowledge.group.Grouping;
import org.precedent.knowledge.store.Knowledge;

/**
 * Retrieval of past tickets for a new question, grouped into candidate answers: BM25 over the
 * questions' words and, when the index holds question vectors, a dense leg over them.
 *
 * <p>The BM25 query is one optional clause per distinct analysed term of the question, so a word
 * repeated in the question counts once. The dense leg asks Lucene's HNSW graph for the question's
 * {@link #NEIGHBOURS} nearest past tickets; their groups that BM25 did not propose are added after
 * BM25's, at most {@link #DENSE_GROUPS}, and every candidate gets its {@link Proximity}. Thread-safe:
 * one instance serves concurrent requests.
 */
public final class Retriever implements Closeable {
  /** Distinct terms a query takes at most; a longer question is cut there and flagged. */
  public static final int MAX_QUERY_TERMS = 256;
  /** Nearest past tickets the dense leg votes with (10 is common practice for kNN, no source). */
  public static final int NEIGHBOURS = 10;
  /**
   * Groups the dense leg may add to BM25's candidates. Three keeps the reranker's work near what it
   * was (the two legs agree on most questions); the project's choice, not a published figure.
   */
  public static final int DENSE_GROUPS = 3;

  private final FSDirectory directory;
  private final DirectoryReader reader;
  private final IndexSearcher searcher;
  private final Analyzer analyzer = TicketIndex.analyzer();
  private final Map<String, AnswerGroup> groups;
  /** Every ticket's vector by Lucene doc id (one segment), and each group's docs; empty if none. */
  private final float[][] vectors;
  private final String[] docIds;
  private final String[] docGroups;
  private final String[] docQuestions;
  private final String[] docCategories;
  private final Map<String, int[]> docsOfGroup;
  private final Map<String, Integer> docOfId = new java.util.HashMap<>();

  private Retriever(FSDirectory directory, Grouping grouping) throws IOException {
    this.directory = directory;
    this.reader = DirectoryReader.open(directory);
    this.searcher = new IndexSearcher(reader);
    this.searcher.setSimilarity(TicketIndex.similarity());
    this.groups = grouping.byId();
    this.vectors = readVectors(reader, reader.maxDoc());
    // Every ticket's id, group, question and category at hand: a decision reads a hundred BM25
    // hits and each would otherwise decompress a block of stored fields (most of retrieval's
    // samples in a profile of `benchmark decisions`). The price: the opening reads every stored
    // ticket once, a BM25-only index too, and holds the questions' text (the cleaned questions,
    // as tickets.jsonl holds them) in memory.
    int n = reader.maxDoc();
    this.docIds = new String[n];
    this.docGroups = new String[n];
    this.docQuestions = new String[n];
    this.docCategories = new String[n];
    StoredFields stored = reader.storedFields();
    for (int d = 0; d < n; d++) {
      Document doc = stored.document(d);
      docIds[d] = doc.get(TicketIndex.ID);
      docGroups[d] = doc.get(TicketIndex.GROUP);
      docQuestions[d] = doc.get(TicketIndex.QUESTION);
      docCategories[d] = doc.get(TicketIndex.CATEGORY);
      docOfId.put(docIds[d], d);
    }
    Map<String, List<Integer>> byGroup = new LinkedHashMap<>();
    for (int d = 0; d < n; d++) {
      if (!docGroups[d].isEmpty()) {
        byGroup.computeIfAbsent(docGroups[d], g -> new ArrayList<>()).add(d);
      }
    }
    Map<String, int[]> docs = new LinkedHashMap<>();
    byGroup.forEach((g, list) -> docs.put(g, list.stream().mapToInt(Integer::intValue).toArray()));
    this.docsOfGroup = docs;
  }

  /** The index's question vectors by doc id (the index is merged to one segment), or none. */
  private static float[][] readVectors(DirectoryReader reader, int n) throws IOException {
    float[][] out = null;
    for (LeafReaderContext leaf : reader.leaves()) {
      FloatVectorValues values = leaf.reader().getFloatVectorValues(TicketIndex.VECTOR);
      if (values == null) {
        continue;
      }
      if (out == null) {
        out = new float[n][];
      }
      for (int d = values.nextDoc(); d != DocIdSetIterator.NO_MORE_DOCS; d = values.nextDoc()) {
        out[leaf.docBase + d] = values.vectorValue().clone();
      }
    }
    if (out == null) {
      return new float[0][];
    }
    for (int d = 0; d < n; d++) {
      if (out[d] == null) {
        throw new IOException("the ticket index holds vectors for some tickets but not for "
            + "ticket " + reader.storedFields().document(d).get(TicketIndex.ID)
            + "; ingest again to rebuild it");
      }
    }
    return out;
  }

  /** Whether the index holds question vectors, so that the dense leg can run. */
  public boolean hasVectors() {
    return vectors.length > 0;
  }

  /** The length of the stored vectors, or 0 without any. */
  public int dimension() {
    return vectors.length == 0 ? 0 : vectors[0].length;
  }

  /** Every stored ticket's question and vector by ticket id (empty without vectors). */
  public Map<String, QuestionVectors.Stored> storedVectors() throws IOException {
    Map<String, QuestionVectors.Stored> out = new LinkedHashMap<>();
    for (int d = 0; d < vectors.length; d++) {
      out.put(docIds[d], new QuestionVectors.Stored(docQuestions[d], vectors[d].clone()));
    }
    return out;
  }

  /** Opens the index of a stored generation; the caller closes it. */
  public static Retriever open(Knowledge knowledge) throws IOException {
    return open(knowledge.indexDirectory(), knowledge.grouping());
  }

  /** Opens the index in {@code indexDir}, whose tickets were grouped as {@code grouping}. */
  public static Retriever open(Path indexDir, Grouping grouping) throws IOException {
    FSDirectory directory = FSDirectory.open(indexDir);
    try {
      return new Retriever(directory, grouping);
    } catch (IOException | RuntimeException e) {
      directory.close();
      throw e;
    }
  }

  /** Number of past tickets in the index. */
  public int size() {
    return reader.numDocs();
  }

  public Retrieval retrieve(String question, RetrievalSettings settings) {
    return retrieve(question, settings, null);
  }

  /**
   * BM25 retrieval as if the past ticket {@code excludedTicket} were not stored: used to ask a
   * stored ticket's question without it finding itself (leave-one-out validation).
   */
  public Retrieval retrieve(String question, RetrievalSettings settings, String excludedTicket) {
    return retrieve(question, null, settings, excludedTicket);
  }

  /**
   * Retrieval by both legs: BM25 over {@code question}, and the dense leg over {@code vector}
   * (the question's unit vector from the encoder that made the stored ones; null for BM25 only).
   */
  public Retrieval retrieve(String question, float[] vector, RetrievalSettings settings,
      String excludedTicket) {
    if (vector != null && vector.length != dimension()) {
      throw new IllegalArgumentException("a query vector of length " + vector.length
          + " for an index whose vectors have length " + dimension());
    }
    List<String> allTerms = terms(question);
    boolean truncated = allTerms.size() > MAX_QUERY_TERMS;
    List<String> terms = truncated ? allTerms.subList(0, MAX_QUERY_TERMS) : allTerms;
    if (terms.isEmpty() && vector == null) {
      return new Retrieval(question, terms, false, List.of(), List.of(), null);
    }
    BooleanQuery.Builder query = new BooleanQuery.Builder();
    for (String term : terms) {
      query.add(new TermQuery(new Term(TicketIndex.QUESTION, term)), BooleanClause.Occur.SHOULD);
    }
    if (excludedTicket != null) {
      query.add(new TermQuery(new Term(TicketIndex.ID, excludedTicket)), BooleanClause.Occur.MUST_NOT);
    }
    try {
      ScoreDoc[] hits = terms.isEmpty() ? new ScoreDoc[0]
          : searcher.search(query.build(), settings.depth()).scoreDocs;
      Set<String> termSet = Set.copyOf(terms);
      Map<String, List<ScoreDoc>> byGroup = new LinkedHashMap<>();
      List<Evidence> references = new ArrayList<>();
      for (ScoreDoc hit : hits) {
        String group = docGroups[hit.doc];
        boolean reference = group.isEmpty() || !groups.containsKey(group);
        if (reference && references.size() >= settings.references()) {
          continue;
        }
        if (reference) {
          references.add(evidence(hit.doc, hit.score, termSet));
        } else {
          byGroup.computeIfAbsent(group, g -> new ArrayList<>()).add(hit);
        }
      }
      List<Candidate> candidates = rank(byGroup, settings, termSet);
      if (vector != null) {
        candidates = withDenseLeg(candidates, vector, settings, excludedTicket, termSet);
      }
      return new Retrieval(question, terms, truncated, candidates, references, vector);
    } catch (IOException e) {
      throw new UncheckedIOException("reading the ticket index failed", e);
    }
  }

  /**
   * BM25's candidates with their proximity, then the groups of the nearest tickets BM25 did not
   * propose, nearest first.
   */
  private List<Candidate> withDenseLeg(List<Candidate> bm25, float[] vector,
      RetrievalSettings settings, String excludedTicket, Set<String> termSet) throws IOException {
    Query filter = null;
    if (excludedTicket != null) {
      filter = new BooleanQuery.Builder()
          .add(new MatchAllDocsQuery(), BooleanClause.Occur.FILTER)
          .add(new TermQuery(new Term(TicketIndex.ID, excludedTicket)), BooleanClause.Occur.MUST_NOT)
          .build();
    }
    ScoreDoc[] near = searcher.search(new KnnFloatVectorQuery(TicketIndex.VECTOR, vector,
        NEIGHBOURS, filter), NEIGHBOURS).scoreDocs;
    Map<String, Integer> votes = new LinkedHashMap<>();
    Map<String, List<Integer>> nearDocs = new LinkedHashMap<>();
    for (ScoreDoc hit : near) {
      String group = docGroups[hit.doc];
      if (!group.isEmpty() && groups.containsKey(group)) {
        votes.merge(group, 1, Integer::sum);
        nearDocs.computeIfAbsent(group, g -> new ArrayList<>()).add(hit.doc);
      }
    }
    int excludedDoc = excludedTicket == null ? -1 : docOfId.getOrDefault(excludedTicket, -1);
    List<Candidate> out = new ArrayList<>();
    Set<String> proposed = new java.util.HashSet<>();
    for (Candidate c : bm25) {
      out.add(new Candidate(c.group(), c.rank(), c.score(), c.hits(), c.evidence(),
          proximity(c.group().id(), vector, votes, excludedDoc)));
      proposed.add(c.group().id());
    }
    int added = 0;
    // The hits come nearest first, so the groups are met in order of their nearest ticket.
    for (Map.Entry<String, List<Integer>> e : nearDocs.entrySet()) {
      if (added == DENSE_GROUPS) {
        break;
      }
      if (proposed.contains(e.getKey())) {
        continue;
      }
      List<Evidence> evidence = new ArrayList<>();
      for (int d : e.getValue().subList(0, Math.min(settings.evidence(), e.getValue().size()))) {
        evidence.add(evidence(d, 0, termSet));
      }
      out.add(new Candidate(groups.get(e.getKey()), out.size() + 1, 0, 0, evidence,
          proximity(e.getKey(), vector, votes, excludedDoc)));
      added++;
    }
    return out;
  }

  private Proximity proximity(String group, float[] vector, Map<String, Integer> votes,
      int excludedDoc) {
    double nearest = -1;
    for (int d : docsOfGroup.getOrDefault(group, new int[0])) {
      if (d != excludedDoc) {
        nearest = Math.max(nearest, dot(vector, vectors[d]));
      }
    }
    return new Proximity(nearest, votes.getOrDefault(group, 0) / (double) NEIGHBOURS);
  }

  /**
   * The dot product, in four running sums: a group's nearest question is a scan over all its
   * tickets' vectors (a tenth of a decision's samples in a profile of the service), and in one sum
   * each addition waits for the last, where four independent ones can overlap.
   */
  static double dot(float[] a, float[] b) {
    double s0 = 0;
    double s1 = 0;
    double s2 = 0;
    double s3 = 0;
    int i = 0;
    for (int n = a.length - 3; i < n; i += 4) {
      s0 += a[i] * b[i];
      s1 += a[i + 1] * b[i + 1];
      s2 += a[i + 2] * b[i + 2];
      s3 += a[i + 3] * b[i + 3];
    }
    for (; i < a.length; i++) {
      s0 += a[i] * b[i];
    }
    return (s0 + s1) + (s2 + s3);
  }

  /**
   * The groups of BM25's hits ranked by their aggregated score; evidence, with its matched terms,
   * is made only for the hits a candidate keeps, since finding the matches re-analyses the text.
   */
  private List<Candidate> rank(Map<String, List<ScoreDoc>> byGroup, RetrievalSettings settings,
      Set<String> termSet) {
    record Scored(String group, double score, List<ScoreDoc> hits) {}
    List<Scored> scored = new ArrayList<>();
    byGroup.forEach((group, hits) -> scored.add(new Scored(group,
        settings.aggregation().combine(hits.stream().map(h -> (double) h.score).toList()), hits)));
    // Ties go to the larger group, then the id, so that rankings are reproducible.
    scored.sort(Comparator.comparingDouble(Scored::score).reversed()
        .thenComparing(s -> -groups.get(s.group()).size())
        .thenComparing(Scored::group));
    List<Candidate> candidates = new ArrayList<>();
    for (Scored s : scored.subList(0, Math.min(settings.candidates(), scored.size()))) {
      List<Evidence> evidence = new ArrayList<>();
      for (ScoreDoc h : s.hits().subList(0, Math.min(settings.evidence(), s.hits().size()))) {
        evidence.add(evidence(h.doc, h.score, termSet));
      }
      candidates.add(new Candidate(groups.get(s.group()), candidates.size() + 1, s.score(),
          s.hits().size(), evidence, Proximity.NONE));
    }
    return candidates;
  }

  private Evidence evidence(int doc, double score, Set<String> termSet) {
    return new Evidence(docIds[doc], score, docQuestions[doc], docCategories[doc],
        matches(docQuestions[doc], termSet));
  }

  /** The distinct analysed terms of a text, in order of first use. */
  List<String> terms(String text) {
    LinkedHashSet<String> terms = new LinkedHashSet<>();
    try (TokenStream stream = analyzer.tokenStream(TicketIndex.QUESTION, text)) {
      CharTermAttribute term = stream.addAttribute(CharTermAttribute.class);
      stream.reset();
      while (stream.incrementToken()) {
        terms.add(term.toString());
      }
      stream.end();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return new ArrayList<>(terms);
  }

  private List<Match> matches(String text, Set<String> queryTerms) {
    List<Match> matches = new ArrayList<>();
    try (TokenStream stream = analyzer.tokenStream(TicketIndex.QUESTION, text)) {
      CharTermAttribute term = stream.addAttribute(CharTermAttribute.class);
      OffsetAttribute offset = stream.addAttribute(OffsetAttribute.class);
      stream.reset();
      while (stream.incrementToken()) {
        if (queryTerms.contains(term.toString())) {
          matches.add(new Match(offset.startOffset(), offset.endOffset(), term.toString()));
        }
      }
      stream.end();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return matches;
  }

  @Override
  public void close() throws IOException {
    try {
      reader.close();
    } finally {
      directory.close();
    }
  }
}
