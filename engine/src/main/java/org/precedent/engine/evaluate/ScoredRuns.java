package org.precedent.engine.evaluate;

import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.precedent.engine.decide.Pipeline;
import org.precedent.engine.evaluate.HeldOutRuns.HeldOutQuestion;
import org.precedent.engine.fusion.ScoringSystem;
import org.precedent.knowledge.io.AtomicFiles;
import org.precedent.knowledge.io.Progress;

/**
 * Held-out questions scored once by a model and kept in a file, so that a benchmark that stops
 * after scoring, or is run again to read its figures, does not score them again. The file names
 * the model (its manifest's SHA-256) and the systems: scores of another model or another reranker
 * setting are not read back. Tab-separated, one line per (split, system, question); written whole
 * through a temporary file and a rename after each split.
 */
final class ScoredRuns {
  private static final String HEADER = "split\tsystem\tticket\tin_scope\trank\tconfidence\treranked";

  private final Path file;
  private final String model;
  private final String systems;
  /** Split name to its runs, one per system in the pipeline's order. */
  private final Map<String, List<SystemRun>> splits = new LinkedHashMap<>();

  /**
   * @param file    where the scores are kept
   * @param model   the fingerprint of the model that scores
   * @param systems the systems it scores with, in order
   */
  ScoredRuns(Path file, String model, List<ScoringSystem> systems) throws IOException {
    this.file = file;
    this.model = model;
    this.systems = String.join(",", systems.stream().map(ScoringSystem::label).toList());
    if (Files.exists(file)) {
      read();
    }
  }

  /** Whether scores of {@code questions} questions of the split are kept. */
  boolean holds(String split, int questions) {
    List<SystemRun> kept = splits.get(split);
    return kept != null && kept.get(0).tickets().size() == questions;
  }

  /** The split's runs: read back when kept, else scored now (with progress) and kept. */
  List<SystemRun> runs(String split, Pipeline pipeline, List<HeldOutQuestion> questions,
      PrintStream progress) throws IOException {
    List<SystemRun> kept = splits.get(split);
    if (holds(split, questions.size())) {
      progress.printf(Locale.ROOT, "%s: %,d questions scored before, read from %s%n", split,
          questions.size(), file);
      return kept;
    }
    List<SystemRun> runs = HeldOutRuns.modelAlone(pipeline, questions,
        new Progress("scoring " + split, "questions", progress));
    splits.put(split, runs);
    write();
    return runs;
  }

  private void write() throws IOException {
    StringBuilder s = new StringBuilder();
    s.append("# model ").append(model).append('\n');
    s.append("# systems ").append(systems).append('\n');
    s.append(HEADER).append('\n');
    splits.forEach((split, runs) -> {
      for (SystemRun run : runs) {
        for (EvaluatedTicket t : run.tickets()) {
          // Double.toString keeps every digit: the thresholds read back are the ones scored.
          s.append(split).append('\t').append(run.name()).append('\t').append(t.ticketId())
              .append('\t').append(t.inScope()).append('\t').append(t.rankOfRight()).append('\t')
              .append(t.confidence()).append('\t').append(t.reranked()).append('\n');
        }
      }
    });
    AtomicFiles.writeString(file, s.toString());
  }

  /** Reads the kept scores, or none when they are another model's or other systems'. */
  private void read() throws IOException {
    List<String> lines = Files.readAllLines(file, StandardCharsets.UTF_8);
    if (lines.size() < 3 || !lines.get(0).equals("# model " + model)
        || !lines.get(1).equals("# systems " + systems)) {
      return;
    }
    if (!lines.get(2).equals(HEADER)) {
      throw new IOException(file + ":3: expected the header '" + HEADER + "'");
    }
    Map<String, Map<String, List<EvaluatedTicket>>> bySplit = new LinkedHashMap<>();
    for (int i = 3; i < lines.size(); i++) {
      String[] f = lines.get(i).split("\t", -1);
      String where = file + ":" + (i + 1) + ": ";
      if (f.length != 7) {
        throw new IOException(where + f.length + " fields, expected 7");
      }
      try {
        bySplit.computeIfAbsent(f[0], k -> new LinkedHashMap<>())
            .computeIfAbsent(f[1], k -> new ArrayList<>())
            .add(new EvaluatedTicket(f[2], "clinc", bool(f[3], "in_scope"),
                (int) number(f[4], "rank"), number(f[5], "confidence"), false, null,
                bool(f[6], "reranked")));
      } catch (IllegalArgumentException e) {
        throw new IOException(where + e.getMessage(), e);
      }
    }
    bySplit.forEach((split, bySystem) -> {
      List<SystemRun> runs = new ArrayList<>();
      bySystem.forEach((system, tickets) -> runs.add(new SystemRun(system, tickets)));
      splits.put(split, runs);
    });
  }

  private static double number(String field, String name) {
    try {
      double value = Double.parseDouble(field);
      if (name.equals("rank") && value != Math.rint(value)) {
        throw new NumberFormatException();
      }
      return value;
    } catch (NumberFormatException e) {
      throw new IllegalArgumentException(name + " is '" + field + "', expected a number", e);
    }
  }

  private static boolean bool(String field, String name) {
    return switch (field) {
      case "true" -> true;
      case "false" -> false;
      default -> throw new IllegalArgumentException(name + " is '" + field
          + "', expected true or false");
    };
  }
}
