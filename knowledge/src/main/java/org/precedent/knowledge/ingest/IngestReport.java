package org.precedent.knowledge.ingest;

import java.util.List;

/**
 * The outcome of one ingest.
 *
 * @param file         the file read
 * @param read         rows read
 * @param stored       new tickets stored
 * @param updated      tickets whose id was already stored, replaced
 * @param rejected     rows not stored
 * @param problems     why each rejected row was rejected (every one, in file order)
 * @param totalTickets tickets in the store afterwards
 * @param groupSizes   size of each answer group afterwards, largest first
 * @param oneOffs      one-off tickets afterwards
 * @param method       how the groups were formed
 * @param proposedOwnDetails contact details redacted from the replies of several answer groups,
 *                     most groups first: likely the organisation's own, to declare as such
 */
public record IngestReport(String file, long read, long stored, long updated, long rejected,
    List<RowProblem> problems, int totalTickets, List<GroupSize> groupSizes, int oneOffs,
    String method, List<ProposedDetail> proposedOwnDetails) {
  public IngestReport {
    problems = List.copyOf(problems);
    groupSizes = List.copyOf(groupSizes);
    proposedOwnDetails = List.copyOf(proposedOwnDetails);
  }

  /**
   * A phone number, e-mail address or web address found in the replies of {@code groups} answer
   * groups.
   *
   * @param kind  "phone", "email" or "url", as the own-details file names it
   * @param value as first written in a reply
   */
  public record ProposedDetail(String kind, String value, int groups, int tickets) {}

  /** One answer group's size, with its category and the start of its canonical answer. */
  public record GroupSize(String id, int size, String category, String canonical) {}
}
