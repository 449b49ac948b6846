package org.precedent.engine.decide;

import java.util.List;
import org.precedent.engine.rerank.AnswerScore;
import org.precedent.engine.rerank.Scorer;
import org.precedent.knowledge.retrieve.Candidate;
import org.precedent.knowledge.retrieve.Retrieval;
import org.precedent.knowledge.retrieve.RetrievalSettings;
import org.precedent.knowledge.retrieve.Retriever;

/**
 * The shared first half of every decision, fit and evaluation: BM25 candidates for a question, and
 * the reranker's score of each candidate's canonical answer in one batched pass.
 *
 * @param retrieval what BM25 found
 * @param scores    the reranker's scores, in the order of {@code retrieval.candidates()}
 */
public record CandidateScoring(Retrieval retrieval, List<AnswerScore> scores) {
  /** Candidates scored by the reranker: the depth the reranker sees (recall@10 bounds it). */
  public static final int CANDIDATES = 10;

  public CandidateScoring {
    scores = List.copyOf(scores);
    if (scores.size() != retrieval.candidates().size()) {
      throw new IllegalArgumentException(scores.size() + " scores for "
          + retrieval.candidates().size() + " candidates");
    }
  }

  public List<Candidate> candidates() {
    return retrieval.candidates();
  }

  /**
   * Retrieves and scores candidates for a cleaned question.
   *
   * @param excludedTicket a stored ticket to leave out (when asking its own question), or null
   */
  public static CandidateScoring of(Retriever retriever, Scorer scorer, String question,
      String excludedTicket) {
    Retrieval retrieval = retriever.retrieve(question,
        RetrievalSettings.standard().withCandidates(CANDIDATES), excludedTicket);
    List<String> answers = retrieval.candidates().stream().map(c -> c.group().canonical()).toList();
    return new CandidateScoring(retrieval, scorer.score(question, answers));
  }
}
