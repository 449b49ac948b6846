package org.precedent.knowledge.ingest;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.BufferedReader;
import java.io.FilterInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.Map;
import java.util.Set;
import java.util.function.Consumer;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;

/**
 * Reads the records of one export file, checking first that it is a non-empty UTF-8 text file.
 *
 * <p>Decoding is strict: a byte sequence that is not UTF-8 stops the read with the line it is on,
 * because guessing another encoding would silently store garbled text.
 */
final class ExportReader {
  private static final int SNIFF_BYTES = 8192;
  private static final ObjectMapper JSON = new ObjectMapper();

  private final Path file;
  private final ExportFormat format;

  ExportReader(Path file, ExportFormat format) {
    this.file = file;
    this.format = format;
  }

  /** Checks the file as a whole: it exists, is readable, non-empty, and looks like text. */
  void checkFile() throws IngestException {
    if (!Files.exists(file)) {
      throw new IngestException(file + ": no such file");
    }
    if (Files.isDirectory(file)) {
      throw new IngestException(file + ": is a directory, not an export file");
    }
    if (!Files.isReadable(file)) {
      throw new IngestException(file + ": not readable (check its permissions)");
    }
    try (InputStream in = Files.newInputStream(file)) {
      byte[] head = in.readNBytes(SNIFF_BYTES);
      if (head.length == 0) {
        throw new IngestException(file + ": the file is empty");
      }
      for (int i = 0; i < head.length; i++) {
        if (head[i] == 0) {
          throw new IngestException(file + ": not a text export (a NUL byte at offset " + i
              + "; binary data, or UTF-16 text: save it as UTF-8 CSV or JSON Lines)");
        }
      }
    } catch (IOException e) {
      throw new IngestException(file + ": cannot read: " + e.getMessage(), e);
    }
  }

  /**
   * Reads every record, passing each to {@code sink}, and the fraction of the file read so far to
   * {@code progress} after each record.
   *
   * @param requiredColumns columns that must be present in the header (CSV) or in each record (JSON)
   */
  void read(Set<String> requiredColumns, Consumer<SourceRow> sink, Consumer<Double> progress)
      throws IngestException {
    long size;
    try {
      size = Math.max(1, Files.size(file));
    } catch (IOException e) {
      throw new IngestException(file + ": cannot read: " + e.getMessage(), e);
    }
    long[] line = {1};
    try (CountingStream counted = new CountingStream(Files.newInputStream(file));
        BufferedReader reader = new BufferedReader(new InputStreamReader(counted,
            StandardCharsets.UTF_8.newDecoder()
                .onMalformedInput(CodingErrorAction.REPORT)
                .onUnmappableCharacter(CodingErrorAction.REPORT)))) {
      skipByteOrderMark(reader);
      Runnable tick = () -> progress.accept(Math.min(1.0, counted.count / (double) size));
      if (format == ExportFormat.CSV) {
        readCsv(reader, requiredColumns, sink, tick, line);
      } else {
        readJsonLines(reader, sink, tick, line);
      }
    } catch (CharacterCodingException e) {
      throw notUtf8();
    } catch (UncheckedIOException e) {
      if (e.getCause() instanceof CharacterCodingException) {
        throw notUtf8();
      }
      throw new IngestException(file + ": near line " + line[0] + ": " + oneLine(e.getCause()), e);
    } catch (IOException e) {
      throw new IngestException(file + ": near line " + line[0] + ": " + oneLine(e), e);
    } catch (IllegalStateException | IllegalArgumentException e) {
      // commons-csv reports malformed quoting and duplicate headers this way.
      throw new IngestException(file + ": near line " + line[0] + ": " + oneLine(e), e);
    }
  }

  /** The decoder reads ahead, so the place of the bad bytes is found by a second, exact pass. */
  private IngestException notUtf8() {
    long[] at = Utf8Scan.firstInvalid(file);
    String where = at == null ? "" : ": line " + at[0] + " (byte " + at[1] + ")";
    return new IngestException(file + where
        + ": not valid UTF-8 text (export the file as UTF-8; other encodings are not guessed)");
  }

  private void readCsv(BufferedReader reader, Set<String> required, Consumer<SourceRow> sink,
      Runnable tick, long[] line) throws IOException, IngestException {
    CSVFormat csv = CSVFormat.RFC4180.builder()
        .setHeader()
        .setSkipHeaderRecord(true)
        .setIgnoreSurroundingSpaces(false)
        .setAllowMissingColumnNames(true)
        .get();
    try (CSVParser parser = CSVParser.builder().setReader(reader).setFormat(csv).get()) {
      Set<String> header = new LinkedHashSet<>(parser.getHeaderNames());
      if (header.isEmpty()) {
        throw new IngestException(file + ": line 1: no header row");
      }
      Set<String> missing = new LinkedHashSet<>(required);
      missing.removeAll(header);
      if (!missing.isEmpty()) {
        throw new IngestException(file + ": line 1: the header lacks mapped column(s) "
            + String.join(", ", missing) + "; it has: " + String.join(", ", header));
      }
      Iterator<CSVRecord> records = parser.iterator();
      while (true) {
        line[0] = parser.getCurrentLineNumber() + 1;
        if (!records.hasNext()) {
          break;
        }
        CSVRecord record = records.next();
        long start = line[0];
        Map<String, String> values = new LinkedHashMap<>();
        if (!record.isConsistent()) {
          sink.accept(SourceRow.unreadable(start, "has " + record.size() + " fields, the header has "
              + header.size()));
          tick.run();
          continue;
        }
        for (String column : header) {
          values.put(column, record.get(column));
        }
        sink.accept(SourceRow.parsed(start, values));
        tick.run();
      }
    }
  }

  /** JSON Lines records may leave out keys (as JSON leaves out nulls): a missing key is empty. */
  private void readJsonLines(BufferedReader reader, Consumer<SourceRow> sink, Runnable tick,
      long[] line) throws IOException {
    String text;
    line[0] = 0;
    while ((text = reader.readLine()) != null) {
      line[0]++;
      if (text.isBlank()) {
        continue;
      }
      JsonNode node;
      try {
        node = JSON.readTree(text);
      } catch (IOException e) {
        sink.accept(SourceRow.unreadable(line[0], "not a JSON object: " + oneLine(e)));
        tick.run();
        continue;
      }
      if (node == null || !node.isObject()) {
        sink.accept(SourceRow.unreadable(line[0], "not a JSON object"));
        tick.run();
        continue;
      }
      Map<String, String> values = new LinkedHashMap<>();
      String problem = null;
      for (var it = node.fields(); it.hasNext(); ) {
        var field = it.next();
        JsonNode value = field.getValue();
        if (value.isNull()) {
          continue;
        }
        if (value.isContainerNode()) {
          problem = "field " + field.getKey() + ": expected text, found a JSON "
              + (value.isArray() ? "array" : "object");
          break;
        }
        values.put(field.getKey(), value.asText());
      }
      sink.accept(problem == null ? SourceRow.parsed(line[0], values)
          : SourceRow.unreadable(line[0], problem));
      tick.run();
    }
  }

  private static void skipByteOrderMark(BufferedReader reader) throws IOException {
    reader.mark(1);
    if (reader.read() != '\uFEFF') {
      reader.reset();
    }
  }

  private static String oneLine(Throwable e) {
    String message = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
    int cut = message.indexOf('\n');
    return cut < 0 ? message : message.substring(0, cut);
  }

  /** Counts the bytes read, so that progress can be given as a share of the file. */
  private static final class CountingStream extends FilterInputStream {
    volatile long count;

    CountingStream(InputStream in) {
      super(in);
    }

    @Override
    public int read() throws IOException {
      int b = super.read();
      if (b >= 0) {
        count++;
      }
      return b;
    }

    @Override
    public int read(byte[] buffer, int offset, int length) throws IOException {
      int n = super.read(buffer, offset, length);
      if (n > 0) {
        count += n;
      }
      return n;
    }
  }
}
