package org.precedent.api.cli;

import java.io.PrintWriter;
import java.util.Locale;
import org.precedent.knowledge.retrieve.Candidate;
import org.precedent.knowledge.retrieve.Evidence;
import org.precedent.knowledge.retrieve.Retrieval;

/** Prints candidate answers with their scores and evidence, matching terms marked *like this*. */
final class RetrievalPrinter {
  private final PrintWriter out;
  private final int answerChars;

  RetrievalPrinter(PrintWriter out, int answerChars) {
    this.out = out;
    this.answerChars = answerChars;
  }

  void print(Retrieval r) {
    out.println("question: " + Text.abbreviate(r.question(), 200));
    out.println("terms:    " + String.join(", ", r.queryTerms())
        + (r.truncated() ? "  (question cut to its first terms)" : ""));
    if (r.candidates().isEmpty()) {
      out.println("no candidate answer: no past question shares a term with this one.");
    }
    for (Candidate c : r.candidates()) {
      out.printf(Locale.ROOT, "%n%d. answer %s  BM25 %.2f  (%s; used %d times; %d of the retrieved "
              + "tickets)%n", c.rank(), c.group().id(), c.score(),
          c.group().category() == null ? "no category" : c.group().category(), c.group().size(),
          c.hits());
      out.println("   " + Text.abbreviate(c.group().canonical(), answerChars));
      for (Evidence e : c.evidence()) {
        printEvidence(e);
      }
    }
    if (!r.references().isEmpty()) {
      out.println();
      out.println("one-off tickets that match (for reading; never sent automatically):");
      r.references().forEach(this::printEvidence);
    }
    out.println();
    out.flush();
  }

  private void printEvidence(Evidence e) {
    out.println(evidenceLine(e));
  }

  /** One evidence ticket on one line: id, BM25 score, question with matched terms *marked*. */
  static String evidenceLine(Evidence e) {
    return evidenceLine(e.ticketId(), e.score(), e.highlighted("*", "*"));
  }

  static String evidenceLine(String ticketId, double score, String highlighted) {
    return String.format(Locale.ROOT, "   - %s  %.2f  %s", ticketId, score,
        Text.abbreviate(highlighted, 110));
  }
}
