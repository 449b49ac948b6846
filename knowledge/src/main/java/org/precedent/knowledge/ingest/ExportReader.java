package org.precedent.knowledge.ingest;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.BufferedReader;
import java.io.FilterInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.function.Consumer;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;

/**
 * Reads the records of one export file, checking first that it is a non-empty UTF-8 text file.
 *
 * <p>Decoding is strict, row by row: a record whose mapped fields hold bytes that are not UTF-8 is
 * reported with the line, field and byte offset, and the other records are read as usual, because
 * guessing another encoding would silently store garbled text. When most records are like that,
 * the file is in another encoding and is refused as a whole.
 */
final class ExportReader {
  private static final int SNIFF_BYTES = 8192;
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final Pattern QUOTE_START = Pattern.compile("\\(startline ([0-9,]+)\\)");
  private static final Pattern AFTER_QUOTE = Pattern.compile("at line: ([0-9,]+)");

  private final Path file;
  private final ExportFormat format;
  private long records;
  private long notUtf8;
  private Utf8Scan.Invalid firstNotUtf8;

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
   * @param requiredColumns columns that must be present in the header (CSV); for both formats,
   *                        the columns whose bytes must be UTF-8 for a record to be read
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
        Utf8Scan scan = new Utf8Scan(counted);
        BufferedReader reader = new BufferedReader(scan)) {
      skipByteOrderMark(reader);
      Runnable tick = () -> progress.accept(Math.min(1.0, counted.count / (double) size));
      if (format == ExportFormat.CSV) {
        readCsv(reader, scan, requiredColumns, sink, tick, line);
      } else {
        readJsonLines(reader, scan, requiredColumns, sink, tick, line);
      }
    } catch (UncheckedIOException e) {
      throw new IngestException(file + ": " + csvProblem(e.getCause(), line[0]), e);
    } catch (IOException e) {
      throw new IngestException(file + ": " + csvProblem(e, line[0]), e);
    } catch (IllegalStateException | IllegalArgumentException e) {
      // commons-csv reports duplicate header names this way.
      throw new IngestException(file + ": near line " + line[0] + ": " + oneLine(e), e);
    }
    // Most records broken means the file is in another encoding, not that a few rows are damaged.
    if (notUtf8 > 0 && notUtf8 * 2 > records) {
      throw new IngestException(String.format(Locale.ROOT, "%s: %,d of %,d rows are not valid UTF-8 "
          + "text (the first on line %d: %s): the file is in another encoding; export it as "
          + "UTF-8 (other encodings are not guessed)", file, notUtf8, records,
          firstNotUtf8.line(), firstNotUtf8));
    }
  }

  /** A parse error of commons-csv, in plain words and with the line where the trouble began. */
  private static String csvProblem(IOException e, long near) {
    String message = oneLine(e);
    Matcher opened = QUOTE_START.matcher(message);
    if (message.contains("EOF reached before encapsulated token finished") && opened.find()) {
      return "line " + number(opened.group(1)) + ": a quoted field opened here is never closed "
          + "(a closing \" is missing, so the rest of the file would be read as this one field)";
    }
    Matcher after = AFTER_QUOTE.matcher(message);
    if (message.startsWith("Invalid character between encapsulated token and delimiter")
        && after.find()) {
      return "line " + number(after.group(1)) + ": a quoted field is closed and then goes on "
          + "before the next comma (inside a quoted field, write a \" as \"\")";
    }
    return "near line " + near + ": " + message;
  }

  private static long number(String grouped) {
    return Long.parseLong(grouped.replace(",", ""));
  }

  private void readCsv(BufferedReader reader, Utf8Scan scan, Set<String> required,
      Consumer<SourceRow> sink, Runnable tick, long[] line) throws IOException, IngestException {
    CSVFormat csv = CSVFormat.RFC4180.builder()
        .setHeader()
        .setSkipHeaderRecord(true)
        .setIgnoreSurroundingSpaces(false)
        .setAllowMissingColumnNames(true)
        .get();
    try (CSVParser parser = CSVParser.builder().setReader(reader).setFormat(csv).get()) {
      Utf8Scan.Invalid inHeader = scan.takeBefore(parser.getCurrentLineNumber() + 1);
      if (inHeader != null) {
        throw new IngestException(file + ": line " + inHeader.line() + ": the header row is not "
            + "valid UTF-8 text (" + inHeader + "); export the file as UTF-8");
      }
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
      Iterator<CSVRecord> iterator = parser.iterator();
      CSVRecord pending = null;
      long pendingStart = 0;
      // A record is passed on once the next one is parsed: only then are the lines it spans known.
      while (true) {
        line[0] = parser.getCurrentLineNumber() + 1;
        boolean more = iterator.hasNext();
        if (pending != null) {
          Utf8Scan.Invalid bad = scan.takeBefore(more ? line[0] : Long.MAX_VALUE);
          sink.accept(csvRow(pending, pendingStart, header, required, bad));
          tick.run();
        }
        if (!more) {
          break;
        }
        pending = iterator.next();
        pendingStart = line[0];
      }
    }
  }

  private SourceRow csvRow(CSVRecord record, long start, Set<String> header, Set<String> required,
      Utf8Scan.Invalid bad) {
    records++;
    if (!record.isConsistent()) {
      return SourceRow.unreadable(start, "has " + record.size() + " fields, the header has "
          + header.size());
    }
    Map<String, String> values = new LinkedHashMap<>();
    for (String column : header) {
      values.put(column, record.get(column));
    }
    SourceRow notUtf8 = notUtf8(start, values, required, bad);
    return notUtf8 != null ? notUtf8 : SourceRow.parsed(start, values);
  }

  /**
   * The problem of a record whose mapped fields hold bytes that are not UTF-8, or null. A bad byte
   * in a column that is not mapped does not matter: nothing of that column is stored.
   */
  private SourceRow notUtf8(long start, Map<String, String> values, Set<String> required,
      Utf8Scan.Invalid bad) {
    if (bad == null) {
      return null;
    }
    for (Map.Entry<String, String> v : values.entrySet()) {
      if (required.contains(v.getKey()) && v.getValue().indexOf(Utf8Scan.REPLACEMENT) >= 0) {
        return notUtf8(start, v.getKey(), bad);
      }
    }
    return null;
  }

  private SourceRow notUtf8(long start, String field, Utf8Scan.Invalid bad) {
    notUtf8++;
    if (firstNotUtf8 == null) {
      firstNotUtf8 = bad;
    }
    return SourceRow.unreadable(start, field, "not valid UTF-8 text: " + bad
        + (bad.line() == start ? "" : " (line " + bad.line() + ")") + "; export the file as UTF-8");
  }

  /** JSON Lines records may leave out keys (as JSON leaves out nulls): a missing key is empty. */
  private void readJsonLines(BufferedReader reader, Utf8Scan scan, Set<String> required,
      Consumer<SourceRow> sink, Runnable tick, long[] line) throws IOException {
    String text;
    line[0] = 0;
    while ((text = reader.readLine()) != null) {
      line[0]++;
      Utf8Scan.Invalid bad = scan.takeBefore(line[0] + 1);
      if (text.isBlank()) {
        continue;
      }
      records++;
      sink.accept(jsonRow(text, line[0], required, bad));
      tick.run();
    }
  }

  private SourceRow jsonRow(String text, long line, Set<String> required, Utf8Scan.Invalid bad) {
    JsonNode node;
    try {
      node = JSON.readTree(text);
    } catch (IOException e) {
      return bad != null ? notUtf8(line, null, bad)
          : SourceRow.unreadable(line, "not a JSON object: " + oneLine(e));
    }
    if (node == null || !node.isObject()) {
      return SourceRow.unreadable(line, "not a JSON object");
    }
    Map<String, String> values = new LinkedHashMap<>();
    for (var it = node.fields(); it.hasNext(); ) {
      var field = it.next();
      JsonNode value = field.getValue();
      if (value.isNull()) {
        continue;
      }
      if (value.isContainerNode()) {
        return SourceRow.unreadable(line, "field " + field.getKey() + ": expected text, found a JSON "
            + (value.isArray() ? "array" : "object"));
      }
      values.put(field.getKey(), value.asText());
    }
    SourceRow notUtf8 = notUtf8(line, values, required, bad);
    return notUtf8 != null ? notUtf8 : SourceRow.parsed(line, values);
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
