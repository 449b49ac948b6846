package org.precedent.api.cli;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;
import org.precedent.knowledge.ingest.ColumnMapping;
import org.precedent.knowledge.ingest.IngestException;
import org.precedent.knowledge.ingest.Ingestor;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;

/** The column mapping options shared by every command that reads an export. */
final class ColumnOptions {
  @Option(names = "--mapping", paramLabel = "FILE", description = "Column mapping file.")
  Path mappingFile;

  @Option(names = "--id", paramLabel = "COLUMN",
      description = "Column of the ticket id (default: file name and line)")
  String id;

  @Option(names = "--question", paramLabel = "COLUMN", description = "Column of the whole question.")
  String question;

  @Option(names = "--subject", paramLabel = "COLUMN", description = "Column of the subject line.")
  String subject;

  @Option(names = "--body", paramLabel = "COLUMN", description = "Column of the message body.")
  String body;

  @Option(names = "--reply", paramLabel = "COLUMN", description = "Column of the agent's reply.")
  String reply;

  @Option(names = "--label", paramLabel = "COLUMN",
      description = "Column of an answer-group label; the labels then define the groups.")
  String label;

  @Option(names = "--category", paramLabel = "COLUMN", description = "Column of a category.")
  String category;

  @Option(names = "--created", paramLabel = "COLUMN", description = "Column of the creation time.")
  String created;

  /**
   * The mapping of an export of new tickets, which has no reply: from --mapping, the column
   * options, or a mapping.properties beside the file; reply, label and created columns are ignored.
   *
   * @throws IngestException when the export itself is missing or not a text file (said first: a
   *     mistyped file name is not a missing mapping)
   * @throws IllegalArgumentException when no question column is named, or a key is unknown
   */
  ColumnMapping newTicketMapping(Path file, CommandSpec spec)
      throws IOException, IngestException {
    Ingestor.checkFile(file);
    Map<String, String> options = new LinkedHashMap<>();
    putIfSet(options, "id", id);
    putIfSet(options, "question", question);
    putIfSet(options, "subject", subject);
    putIfSet(options, "body", body);
    putIfSet(options, "category", category);
    Path mappingPath = mappingFile;
    if (mappingPath == null && question == null && subject == null && body == null) {
      Path beside = file.toAbsolutePath().resolveSibling("mapping.properties");
      if (!Files.exists(beside)) {
        throw new IllegalArgumentException("say which column holds the question: --question "
            + "COLUMN, or --subject/--body COLUMN, or --mapping FILE");
      }
      mappingPath = beside;
      spec.commandLine().getErr().println("using the column mapping in " + beside);
    }
    if (question != null && (subject != null || body != null)) {
      throw new IllegalArgumentException("name either --question or --subject/--body, not both");
    }
    return mappingPath == null ? ColumnMapping.forNewTickets(options)
        : ColumnMapping.newTicketsFromFile(mappingPath, options);
  }

  private static void putIfSet(Map<String, String> out, String key, String column) {
    if (column != null && !column.isBlank()) {
      out.put(key, column.strip());
    }
  }

  /**
   * The mapping from --mapping, the column options, or a mapping.properties beside the file.
   *
   * @throws IngestException when the export itself is missing or not a text file (said first: a
   *     mistyped file name is not a missing mapping)
   * @throws IllegalArgumentException when none of them says which column holds what
   */
  ColumnMapping mapping(Path file, CommandSpec spec) throws IOException, IngestException {
    Ingestor.checkFile(file);
    Map<String, String> options = new LinkedHashMap<>();
    options.put("id", id);
    options.put("question", question);
    options.put("subject", subject);
    options.put("body", body);
    options.put("reply", reply);
    options.put("label", label);
    options.put("category", category);
    options.put("created", created);
    Path mappingPath = mappingFile;
    if (mappingPath == null && options.values().stream().allMatch(v -> v == null)) {
      Path beside = file.toAbsolutePath().resolveSibling("mapping.properties");
      if (!Files.exists(beside)) {
        throw new IllegalArgumentException("say which column holds what: --mapping FILE, or "
            + "--question COLUMN (or --subject/--body) and --reply COLUMN (or --label COLUMN)");
      }
      mappingPath = beside;
      spec.commandLine().getErr().println("using the column mapping in " + beside);
    }
    return mappingPath == null ? ColumnMapping.of(options)
        : ColumnMapping.fromFile(mappingPath, options);
  }
}
