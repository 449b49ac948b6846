package org.precedent.knowledge.clean;

import java.util.ArrayList;
import java.util.List;

/**
 * Line-based removal of everything in a mail that is not its substance: quoted earlier messages,
 * signatures, greetings and sign-offs. Openings and closings are stripped repeatedly until none is
 * left, so stripping an already stripped text changes nothing.
 */
final class MailStripper {
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
    boolean changed;
    do {
      changed = Salutations.strip(lines, agentReply);
      changed |= SignOffs.strip(lines, agentReply);
    } while (changed);
    return String.join("\n", lines);
  }
}
