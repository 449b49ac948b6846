package org.precedent.api.cli;

import java.io.PrintWriter;
import java.util.List;
import java.util.Locale;
import org.precedent.engine.decide.Decision;
import org.precedent.engine.decide.Outcome;
import org.precedent.engine.decide.ScoredCandidate;
import org.precedent.knowledge.retrieve.Evidence;

/** Prints a decision: outcome, reason, caution, then the ranked candidates with their evidence. */
final class DecisionPrinter {
  private final PrintWriter out;
  private final int candidates;

  DecisionPrinter(PrintWriter out, int candidates) {
    this.out = out;
    this.candidates = candidates;
  }

  void print(Decision d) {
    out.println("question: " + Text.abbreviate(d.question(), 200)
        + (d.truncated() ? "  (cut to the length the models take)" : ""));
    if (d.outcome() == Outcome.REPLY) {
      out.printf(Locale.ROOT, "REPLY  confidence %.2f >= threshold %.2f%n", d.confidence(),
          d.threshold());
      out.println("   " + Text.abbreviate(d.reply(), 400));
    } else {
      out.printf(Locale.ROOT, "HAND OFF (%s)  confidence %.2f, threshold %.2f%n",
          d.reason().name().toLowerCase(Locale.ROOT).replace('_', ' '), d.confidence(),
          d.threshold());
      if (d.caution() != null) {
        out.println("   caution for the customer: " + d.caution());
      }
    }
    out.println("   why: " + d.explanation());
    List<ScoredCandidate> shown = d.candidates().subList(0, Math.min(candidates,
        d.candidates().size()));
    for (int i = 0; i < shown.size(); i++) {
      ScoredCandidate c = shown.get(i);
      out.printf(Locale.ROOT, "%n%d. answer %s  P(right) %.2f  BM25 %.2f (rank %d)  reranker %.1f "
              + "(%.2f per token)  used %d times%n", i + 1, c.candidate().group().id(),
          c.probability(), c.candidate().score(), c.candidate().rank(), c.rerank().antiLm(),
          c.rerank().perTokenLogLikelihood(), c.candidate().group().size());
      out.println("   " + Text.abbreviate(c.candidate().group().canonical(), 160));
      for (Evidence e : c.candidate().evidence()) {
        out.println(RetrievalPrinter.evidenceLine(e));
      }
    }
    out.println();
    out.flush();
  }
}
