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
import org.apache.lucene.index.StoredFields;
import org.apache.lucene.index.Term;
import org.apache.lucene.search.BooleanClause;
import org.apache.lucene.search.BooleanQuery;
import org.apache.lucene.search.IndexSearcher;
import org.apache.lucene.search.ScoreDoc;
import org.apache.lucene.search.TermQuery;
import org.apache.lucene.store.FSDirectory;
import org.precedent.knowledge.group.AnswerGroup;
import org.precedent.knowledge.group.Grouping;
import org.precedent.knowledge.store.Knowledge;

/**
 * BM25 retrieval of past tickets for a new question, grouped into candidate answers.
 *
 * <p>The query is one optional clause per distinct analysed term of the question, so a word repeated
 * in the question counts once. Thread-safe: one instance serves concurrent requests.
 */
public final class Retriever implements Closeable {
  /** Distinct terms a query takes at most; a longer question is cut there and flagged. */
  public static final int MAX_QUERY_TERMS = 256;

  private final FSDirectory directory;
  private final DirectoryReader reader;
  private final IndexSearcher searcher;
  private final Analyzer analyzer = TicketIndex.analyzer();
  private final Map<String, AnswerGroup> groups;

  private Retriever(FSDirectory directory, Grouping grouping) throws IOException {
    this.directory = directory;
    this.reader = DirectoryReader.open(directory);
    this.searcher = new IndexSearcher(reader);
    this.searcher.setSimilarity(TicketIndex.similarity());
    this.groups = grouping.byId();
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
   * Retrieval as if the past ticket {@code excludedTicket} were not stored: used to ask a stored
   * ticket's question without it finding itself (leave-one-out validation).
   */
  public Retrieval retrieve(String question, RetrievalSettings settings, String excludedTicket) {
    List<String> allTerms = terms(question);
    boolean truncated = allTerms.size() > MAX_QUERY_TERMS;
    List<String> terms = truncated ? allTerms.subList(0, MAX_QUERY_TERMS) : allTerms;
    if (terms.isEmpty()) {
      return new Retrieval(question, terms, false, List.of(), List.of());
    }
    BooleanQuery.Builder query = new BooleanQuery.Builder();
    for (String term : terms) {
      query.add(new TermQuery(new Term(TicketIndex.QUESTION, term)), BooleanClause.Occur.SHOULD);
    }
    if (excludedTicket != null) {
      query.add(new TermQuery(new Term(TicketIndex.ID, excludedTicket)), BooleanClause.Occur.MUST_NOT);
    }
    try {
      ScoreDoc[] hits = searcher.search(query.build(), settings.depth()).scoreDocs;
      StoredFields stored = searcher.storedFields();
      Set<String> termSet = Set.copyOf(terms);
      Map<String, List<Evidence>> byGroup = new LinkedHashMap<>();
      List<Evidence> references = new ArrayList<>();
      for (ScoreDoc hit : hits) {
        Document doc = stored.document(hit.doc);
        String group = doc.get(TicketIndex.GROUP);
        boolean reference = group.isEmpty() || !groups.containsKey(group);
        if (reference && references.size() >= settings.references()) {
          continue;
        }
        String text = doc.get(TicketIndex.QUESTION);
        Evidence evidence = new Evidence(doc.get(TicketIndex.ID), hit.score, text,
            doc.get(TicketIndex.CATEGORY), matches(text, termSet));
        if (reference) {
          references.add(evidence);
        } else {
          byGroup.computeIfAbsent(group, g -> new ArrayList<>()).add(evidence);
        }
      }
      return new Retrieval(question, terms, truncated, rank(byGroup, settings), references);
    } catch (IOException e) {
      throw new UncheckedIOException("reading the ticket index failed", e);
    }
  }

  private List<Candidate> rank(Map<String, List<Evidence>> byGroup, RetrievalSettings settings) {
    record Scored(String group, double score, List<Evidence> evidence) {}
    List<Scored> scored = new ArrayList<>();
    byGroup.forEach((group, evidence) -> scored.add(new Scored(group,
        settings.aggregation().combine(evidence.stream().map(Evidence::score).toList()), evidence)));
    // Ties go to the larger group, then the id, so that rankings are reproducible.
    scored.sort(Comparator.comparingDouble(Scored::score).reversed()
        .thenComparing(s -> -groups.get(s.group()).size())
        .thenComparing(Scored::group));
    List<Candidate> candidates = new ArrayList<>();
    for (Scored s : scored.subList(0, Math.min(settings.candidates(), scored.size()))) {
      candidates.add(new Candidate(groups.get(s.group()), candidates.size() + 1, s.score(),
          s.evidence().size(), s.evidence().subList(0, Math.min(settings.evidence(),
              s.evidence().size()))));
    }
    return candidates;
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
