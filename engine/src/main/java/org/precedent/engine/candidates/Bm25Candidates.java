package org.precedent.engine.candidates;

import org.precedent.knowledge.retrieve.Retrieval;
import org.precedent.knowledge.retrieve.RetrievalSettings;
import org.precedent.knowledge.retrieve.Retriever;

/** BM25 over past questions, cut to the depth the reranker sees. */
public final class Bm25Candidates implements CandidateSource {
  /** Candidates scored by the reranker: the depth the reranker sees (recall@10 bounds it). */
  public static final int DEPTH = 10;

  private final Retriever retriever;

  public Bm25Candidates(Retriever retriever) {
    this.retriever = retriever;
  }

  @Override
  public Retrieval retrieve(String question, String excludedTicket) {
    return retriever.retrieve(question, RetrievalSettings.standard().withCandidates(DEPTH),
        excludedTicket);
  }
}
