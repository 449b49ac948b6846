package org.precedent.engine.candidates;

import org.precedent.knowledge.embed.SentenceEncoder;
import org.precedent.knowledge.retrieve.Retrieval;
import org.precedent.knowledge.retrieve.RetrievalSettings;
import org.precedent.knowledge.retrieve.Retriever;

/**
 * BM25's candidates and the dense leg's: the question is embedded by the encoder that embedded the
 * stored questions, and retrieval adds the groups of its nearest past questions that BM25 missed.
 */
public final class HybridCandidates implements CandidateSource {
  private final Retriever retriever;
  private final SentenceEncoder encoder;

  /**
   * @throws IllegalArgumentException when the index holds no vectors, or vectors of another length
   */
  public HybridCandidates(Retriever retriever, SentenceEncoder encoder) {
    if (!retriever.hasVectors() || retriever.dimension() != encoder.dimension()) {
      throw new IllegalArgumentException("the index holds " + (retriever.hasVectors()
          ? "vectors of length " + retriever.dimension() : "no vectors") + ", so encoder "
          + encoder.identity().model() + " (length " + encoder.dimension()
          + ") cannot search it");
    }
    this.retriever = retriever;
    this.encoder = encoder;
  }

  @Override
  public Retrieval retrieve(String question, String excludedTicket) {
    // A blank question has no meaning to embed: its nearest neighbours would be noise.
    float[] vector = question.isBlank() ? null : encoder.embed(question);
    return retriever.retrieve(question, vector,
        RetrievalSettings.standard().withCandidates(Bm25Candidates.DEPTH), excludedTicket);
  }
}
