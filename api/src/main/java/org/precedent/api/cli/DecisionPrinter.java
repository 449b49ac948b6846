package org.precedent.api.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.precedent.engine.decide.Decision;
import org.precedent.engine.decide.Outcome;
import org.precedent.engine.explain.Explanation;
import org.precedent.engine.fusion.ScoredCandidate;
import org.precedent.engine.measure.ThresholdDecimals;
import org.precedent.knowledge.retrieve.Evidence;

/**
 * Prints a decision: outcome, reason, caution, then the candidates in the fused order with their
 * evidence.
 */
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
    // One chance per answer: the calibrated confidence that the best answer is right, cut to the
    // threshold's decimals so that it never prints at or above a threshold it is below.
    String confidence = ThresholdDecimals.confidence(d.confidence(), d.threshold());
    String threshold = ThresholdDecimals.of(d.threshold());
    if (d.outcome() == Outcome.REPLY) {
      out.println("REPLY  confidence " + confidence + " that this answer is right, threshold "
          + threshold);
      out.println("   " + Text.abbreviate(d.reply(), 400));
    } else {
      out.println("HAND OFF (" + d.reason().name().toLowerCase(Locale.ROOT).replace('_', ' ')
          + ")  confidence " + confidence + " that the best answer is right, threshold "
          + threshold);
      if (d.caution() != null) {
        out.println("   caution for the customer: " + d.caution());
      }
    }
    out.println("   why: " + d.explanation());
    out.println("   made of: " + parts(d.why()));
    List<ScoredCandidate> shown = d.candidates().subList(0, Math.min(candidates,
        d.candidates().size()));
    for (int i = 0; i < shown.size(); i++) {
      ScoredCandidate c = shown.get(i);
      // The candidates' own scores order them; only the first has a calibrated chance (above).
      out.printf(Locale.ROOT, "%n%d. answer %s%s  BM25 %.2f (rank %d)  reranker %.1f "
              + "(%.2f per token)  used %d times%n", i + 1, c.candidate().group().id(),
          i == 0 ? "  (the best answer)" : "", c.candidate().score(), c.candidate().rank(),
          c.rerank().antiLm(), c.rerank().perTokenLogLikelihood(), c.candidate().group().size());
      out.println("   " + Text.abbreviate(c.candidate().group().canonical(), 160));
      for (Evidence e : c.candidate().evidence()) {
        out.println(RetrievalPrinter.evidenceLine(e));
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
