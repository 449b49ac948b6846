package org.precedent.knowledge.clean;

import java.util.ArrayList;
import java.util.List;

/**
 * Line-based removal of everything in a mail that is not its substance: quoted earlier messages,
 * signatures, greetings and sign-offs. Openings and closings are stripped repeatedly until none is
 * left, so stripping an already stripped text changes nothing.
 */
final class MailStripper {
  /**
   * The most openings and closings taken from one text. A mail has a handful; each one taken reads
   * its line again, so without a bound a text of thousands of stacked "Thanks." would cost a pass
   * per sign-off, quadratic in its length. Past the bound the rest stays in the text (and a second
   * cleaning takes the next ones: only such a text is not cleaned in one go).
   */
  static final int MAX_REMOVALS = 32;
  private final boolean agentReply;

  MailStripper(boolean agentReply) {
    this.agentReply = agentReply;
  }

  /** The stripped form of a normalised text, possibly empty; lines come back trimmed. */
  String strip(String text) {
    List<String> lines = new ArrayList<>();
    for (String line : Whitespace.lines(text)) {
      lines.add(line.strip());
    }
    QuoteCutter.cut(lines);
    int left = MAX_REMOVALS;
    while (left > 0) {
      int openings = Salutations.strip(lines, agentReply, left);
      int closings = SignOffs.strip(lines, agentReply, left - openings);
      if (openings + closings == 0) {
        break;
      }
      left -= openings + closings;
    }
    return String.join("\n", lines);
  }
}
