package org.precedent.knowledge.ingest;

import java.nio.file.Path;
import java.util.Locale;

/** The export formats Precedent reads. */
public enum ExportFormat {
  /** Comma-separated values as RFC 4180 defines them, UTF-8, with a header row. */
  CSV,
  /** One JSON object per line (JSON Lines), UTF-8. */
  JSONL;

  /** The format a file name implies: .jsonl, .ndjson and .json are JSON Lines, anything else CSV. */
  public static ExportFormat of(Path file) {
    String name = file.getFileName().toString().toLowerCase(Locale.ROOT);
    return name.endsWith(".jsonl") || name.endsWith(".ndjson") || name.endsWith(".json") ? JSONL : CSV;
  }
}
