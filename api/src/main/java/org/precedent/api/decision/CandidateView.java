package org.precedent.api.decision;

import java.util.List;
import org.precedent.engine.fusion.ScoredCandidate;

/**
 * One proposed answer.
 *
 * @param rank        1 for the best
 * @param answerGroup the answer's id
 * @param answer      the answer's text, as past agents wrote it (cleaned)
 * @param probability the fused model's score, used to order the answers; not calibrated, so not
 *                    a chance to rely on (kept for callers that sort by it): the decision's
 *                    {@code confidence} is the calibrated chance that the first answer is right
 * @param bm25        the word-overlap score of its past tickets
 * @param bm25Rank    its place in BM25's own order, 1 for the first
 * @param reranker    the reranker's score of its text as a reply to this question (the text's
 *                    log-likelihood given the question less its log-likelihood alone); null when
 *                    the reranker did not run for this question (BM25 and the dense leg agreed)
 * @param rerankerPerToken the text's log-likelihood given the question, per token; null likewise
 * @param usedTimes   how many past tickets it resolved
 * @param category    the category most of those tickets had, if any
 * @param evidence    the past tickets that support it, best first
 */
public record CandidateView(int rank, String answerGroup, String answer, double probability,
    double bm25, int bm25Rank, Double reranker, Double rerankerPerToken, int usedTimes,
    String category, List<EvidenceView> evidence) {

  static CandidateView of(int rank, ScoredCandidate c) {
    return new CandidateView(rank, c.candidate().group().id(), c.candidate().group().canonical(),
        c.probability(), c.candidate().score(), c.candidate().rank(),
        c.rerank() == null ? null : c.rerank().antiLm(),
        c.rerank() == null ? null : c.rerank().perTokenLogLikelihood(), c.candidate().group().size(),
        c.candidate().group().category(),
        c.candidate().evidence().stream().map(EvidenceView::of).toList());
  }
}
