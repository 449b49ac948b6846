package org.precedent.api.triage;

import com.fasterxml.jackson.annotation.JsonInclude;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.List;
import java.util.Optional;
import org.precedent.engine.decide.Pipeline;
import org.precedent.api.decision.DecisionView;
import org.precedent.engine.decide.Decision;
import org.precedent.knowledge.ingest.NewTicket;

/**
 * Decides a file of new tickets into JSON Lines, resumable after a crash at any moment: lines are
 * appended and forced to disk in batches, then the progress file records the batch. A rerun cuts
 * the output back to the recorded length and goes on with the next ticket, so no ticket is
 * skipped or written twice.
 */
public final class TriageRun {
  private static final ObjectMapper JSON = new ObjectMapper()
      .setSerializationInclusion(JsonInclude.Include.NON_NULL);

  private final Pipeline pipeline;
  private final String version;
  private final int commitEvery;

  /** What a run did. */
  public record Result(long resumedAt, long decided, long replies, long handOffs, long errors) {}

  public TriageRun(Pipeline pipeline, String version, int commitEvery) {
    if (commitEvery < 1) {
      throw new IllegalArgumentException("commit interval must be at least 1, got " + commitEvery);
    }
    this.pipeline = pipeline;
    this.version = version;
    this.commitEvery = commitEvery;
  }

  /**
   * @param inputSize size of the input file, recorded to notice an input changed between runs
   * @throws IllegalStateException when the output exists without a run to resume, or the input
   *     changed since the interrupted run
   */
  public Result run(List<NewTicket> tickets, long inputSize, Path out) throws IOException {
    Optional<TriageProgress> saved = TriageProgress.read(out);
    if (saved.isEmpty() && Files.exists(out) && Files.size(out) > 0) {
      throw new IllegalStateException(out + " exists and holds no unfinished triage: choose "
          + "another --out, or remove it");
    }
    if (saved.isPresent() && saved.get().input() != inputSize) {
      throw new IllegalStateException("the input changed since the interrupted triage into " + out
          + " (" + saved.get().input() + " bytes then, " + inputSize + " now): rerun it with "
          + "the same input, or remove " + out + " and " + TriageProgress.fileFor(out));
    }
    TriageProgress progress = saved.orElse(new TriageProgress(0, 0, inputSize));
    if (saved.isEmpty()) {
      progress.write(out);
    }
    long replies = 0;
    long handOffs = 0;
    long errors = 0;
    try (FileChannel channel = FileChannel.open(out, StandardOpenOption.CREATE,
        StandardOpenOption.WRITE)) {
      // Lines written after the last recorded batch were never committed: cut them off.
      channel.truncate(progress.bytes());
      ByteArrayOutputStream batch = new ByteArrayOutputStream();
      int inBatch = 0;
      for (long i = progress.tickets(); i < tickets.size(); i++) {
        NewTicket t = tickets.get((int) i);
        TriageLine line;
        if (t.problem() != null) {
          line = TriageLine.failed(t);
          errors++;
        } else {
          Decision d = pipeline.decideCleaned(t.question(), t.category());
          line = TriageLine.of(t, DecisionView.of(d, version, 0));
          if (line.outcome().equals("REPLY")) {
            replies++;
          } else {
            handOffs++;
          }
        }
        batch.write(JSON.writeValueAsBytes(line));
        batch.write('\n');
        inBatch++;
        if (inBatch == commitEvery || i == tickets.size() - 1) {
          progress = commit(channel, batch, progress, inBatch, out);
          batch.reset();
          inBatch = 0;
        }
      }
    }
    long resumedAt = saved.map(TriageProgress::tickets).orElse(0L);
    Files.deleteIfExists(TriageProgress.fileFor(out));
    return new Result(resumedAt, tickets.size() - resumedAt, replies, handOffs, errors);
  }

  private static TriageProgress commit(FileChannel channel, ByteArrayOutputStream batch,
      TriageProgress progress, int count, Path out) throws IOException {
    ByteBuffer bytes = ByteBuffer.wrap(batch.toByteArray());
    long at = progress.bytes();
    while (bytes.hasRemaining()) {
      at += channel.write(bytes, at);
    }
    channel.force(false);
    TriageProgress next = new TriageProgress(progress.tickets() + count, at, progress.input());
    next.write(out);
    return next;
  }
}
