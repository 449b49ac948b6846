/**
 * Retrieval of past tickets for a new question, and the candidate answers they vote for: BM25 over
 * the words and, when the index holds the questions' vectors, a dense leg over those (Lucene's HNSW
 * graph), whose closeness each candidate carries as a {@link
 * org.precedent.knowledge.retrieve.Proximity}. {@link
 * org.precedent.knowledge.retrieve.TicketIndex} builds a stored generation's Lucene index of cleaned
 * questions (English analysis by {@link org.precedent.knowledge.retrieve.QuestionAnalyzer}, BM25 with
 * k1 1.2 and b 0.75); {@link org.precedent.knowledge.retrieve.Retriever} opens it and turns the top
 * tickets into {@link org.precedent.knowledge.retrieve.Candidate} answer groups, scored by an {@link
 * org.precedent.knowledge.retrieve.Aggregation} and carrying their {@link
 * org.precedent.knowledge.retrieve.Evidence}; {@link org.precedent.knowledge.retrieve.CandidateRecall}
 * measures recall@k. The package depends on Lucene, {@code knowledge.embed} (vectors at ingest), {@code
 * knowledge.ticket}, {@code knowledge.group},
 * {@code knowledge.io} and {@code knowledge.store} (it builds and opens the index of a stored
 * generation); the store does not depend on it, and the engine reads its records.
 */
package org.precedent.knowledge.retrieve;
