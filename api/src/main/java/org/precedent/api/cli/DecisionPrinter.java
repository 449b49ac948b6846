package org.precedent.api.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.precedent.api.decision.CandidateView;
import org.precedent.api.decision.DecisionView;
import org.precedent.api.decision.EvidenceView;
import org.precedent.engine.decide.Decision;
import org.precedent.engine.decide.Outcome;
import org.precedent.engine.explain.Explanation;
import org.precedent.engine.measure.ThresholdDecimals;

/**
 * Prints a decision as text: outcome, reason, caution, then the candidates in the fused order with
 * their evidence. It prints the service's view of the decision, so that {@code ask} shows what the
 * service returns.
 */
final class DecisionPrinter {
  private final PrintWriter out;
  private final int candidates;

  DecisionPrinter(PrintWriter out, int candidates) {
    this.out = out;
    this.candidates = candidates;
  }

  /** Prints an engine decision made on model {@code version}, as the service would show it. */
  void print(Decision d, String version) {
    print(DecisionView.of(d, version, candidates));
  }

  void print(DecisionView d) {
    out.println("question: " + Text.abbreviate(d.question(), 200)
        + (d.truncated() ? "  (cut to the length the models take)" : ""));
    // One chance per answer: the calibrated confidence that the best answer is right, cut to the
    // threshold's decimals so that it never prints at or above a threshold it is below.
    String confidence = ThresholdDecimals.confidence(d.confidence(), d.threshold());
    String threshold = ThresholdDecimals.of(d.threshold());
    if (Outcome.REPLY.name().equals(d.outcome())) {
      out.println("REPLY  confidence " + confidence + " that this answer is right, threshold "
          + threshold);
      out.println("   " + Text.abbreviate(d.reply(), 400));
    } else {
      out.println("HAND OFF (" + d.reason().replace('_', ' ')
          + ")  confidence " + confidence + " that the best answer is right, threshold "
          + threshold);
      if (d.caution() != null) {
        out.println("   caution for the customer: " + d.caution());
      }
    }
    out.println("   why: " + d.explanation());
    out.println("   made of: " + parts(d.why()));
    List<CandidateView> shown = d.candidates().subList(0, Math.min(candidates,
        d.candidates().size()));
    for (CandidateView c : shown) {
      // The candidates' own scores order them; only the first has a calibrated chance (above).
      out.printf(Locale.ROOT, "%n%d. answer %s%s  BM25 %.2f (rank %d)  %s  used %d times%n",
          c.rank(), c.answerGroup(), c.rank() == 1 ? "  (the best answer)" : "", c.bm25(),
          c.bm25Rank(), c.reranker() == null ? "reranker not run"
              : String.format(Locale.ROOT, "reranker %.1f (%.2f per token)", c.reranker(),
                  c.rerankerPerToken()), c.usedTimes());
      out.println("   " + Text.abbreviate(c.answer(), 160));
      for (EvidenceView e : c.evidence()) {
        out.println(RetrievalPrinter.evidenceLine(e.ticketId(), e.score(),
            e.highlighted("*", "*")));
      }
    }
    out.println();
    out.flush();
  }

  /** The explanation's parts in one line, with the three largest terms of the logit. */
  static String parts(Explanation why) {
    List<String> parts = new ArrayList<>();
    for (Explanation p : why.parts()) {
      parts.add(p.value() == null ? p.name() + " " + p.detail()
          : String.format(Locale.ROOT, "%s %.3f", p.name(), p.value()));
    }
    why.find("logit").ifPresent(logit -> {
      List<String> terms = new ArrayList<>();
      for (Explanation t : logit.parts().subList(0, Math.min(3, logit.parts().size()))) {
        terms.add(String.format(Locale.ROOT, "%s %+.2f", t.name(), t.value()));
      }
      parts.add(String.format(Locale.ROOT, "logit %.2f, largest terms %s", logit.value(),
          String.join(", ", terms)));
    });
    return String.join("; ", parts);
  }
}
