package org.precedent.engine.rerank.tokens;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collection;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import org.precedent.knowledge.io.AtomicFiles;

/**
 * The fixed token list of one model: token to id and back.
 *
 * <p>Ids 0..3 are reserved: {@code <pad>}=0 (so all-zero padding is padding), {@code <unk>}, {@code <s>}
 * (start of an answer) and {@code </s>} (end of a question or answer). The rest are the most frequent
 * tokens of the training text, ties broken alphabetically so the same data always gives the same ids.
 *
 * <p>On disk: a header line, the size, the SHA-256 of the token lines, then one token per line. The
 * checksum catches a file cut short or edited, which would otherwise silently shift every id.
 */
public final class Vocabulary {

  public static final String PAD = "<pad>";
  public static final String UNK = "<unk>";
  public static final String START = "<s>";
  public static final String END = "</s>";
  public static final int PAD_ID = 0;
  public static final int UNK_ID = 1;
  public static final int START_ID = 2;
  public static final int END_ID = 3;

  private static final String HEADER = "# precedent reranker vocabulary, format 1";

  private final List<String> tokens;
  private final Map<String, Integer> ids;

  private Vocabulary(List<String> tokens) {
    this.tokens = List.copyOf(tokens);
    this.ids = new HashMap<>(tokens.size() * 2);
    for (int i = 0; i < tokens.size(); i++) {
      if (tokens.get(i).isEmpty() || tokens.get(i).chars().anyMatch(c -> c == '\n' || c == '\r')) {
        throw new IllegalArgumentException("token is empty or holds a line break: '" + tokens.get(i) + "'");
      }
      if (ids.put(tokens.get(i), i) != null) {
        throw new IllegalArgumentException("token appears twice in vocabulary: " + tokens.get(i));
      }
    }
  }

  /**
   * Builds a vocabulary from tokenized texts.
   *
   * @param sizeCap  the most ids in total, reserved ones included (at least 5)
   * @param minCount a token seen fewer times than this becomes {@code <unk>}
   */
  public static Vocabulary build(Collection<List<String>> texts, int sizeCap, int minCount) {
    if (sizeCap < 5) {
      throw new IllegalArgumentException("vocabulary cap must be at least 5, was " + sizeCap);
    }
    Map<String, Integer> counts = new HashMap<>();
    for (List<String> text : texts) {
      for (String t : text) {
        counts.merge(t, 1, Integer::sum);
      }
    }
    List<String> tokens = new ArrayList<>(List.of(PAD, UNK, START, END));
    counts.entrySet().stream()
        .filter(e -> e.getValue() >= minCount && !isReserved(e.getKey()))
        .sorted(Map.Entry.<String, Integer>comparingByValue(Comparator.reverseOrder())
            .thenComparing(Map.Entry.comparingByKey()))
        .limit(sizeCap - 4L)
        .forEach(e -> tokens.add(e.getKey()));
    return new Vocabulary(tokens);
  }

  private static boolean isReserved(String token) {
    return token.equals(PAD) || token.equals(UNK) || token.equals(START) || token.equals(END);
  }

  public int size() {
    return tokens.size();
  }

  public int id(String token) {
    return ids.getOrDefault(token, UNK_ID);
  }

  public String token(int id) {
    return tokens.get(id);
  }

  /** Ids of the tokens, unknown ones as {@code <unk>}. */
  public int[] ids(List<String> tokenList) {
    int[] out = new int[tokenList.size()];
    for (int i = 0; i < out.length; i++) {
      out[i] = id(tokenList.get(i));
    }
    return out;
  }

  public void save(Path file) throws IOException {
    String body = String.join("\n", tokens);
    String text = HEADER + "\n" + "size=" + tokens.size() + "\n" + "sha256=" + checksum(body) + "\n" + body + "\n";
    AtomicFiles.writeString(file, text);
  }

  /** Reads a saved vocabulary; a wrong header, size or checksum is an {@link IOException} naming the file. */
  public static Vocabulary load(Path file) throws IOException {
    List<String> lines = Files.readAllLines(file, StandardCharsets.UTF_8);
    if (lines.size() < 3 || !lines.get(0).equals(HEADER)
        || !lines.get(1).startsWith("size=") || !lines.get(2).startsWith("sha256=")) {
      throw new IOException("not a reranker vocabulary file (bad header): " + file);
    }
    int size;
    try {
      size = Integer.parseInt(lines.get(1).substring(5));
    } catch (NumberFormatException e) {
      throw new IOException("vocabulary file has a bad size line: " + file, e);
    }
    List<String> tokens = lines.subList(3, lines.size());
    if (tokens.size() != size) {
      throw new IOException("vocabulary file " + file + " lists " + tokens.size()
          + " tokens but its header says " + size + " (truncated or edited?)");
    }
    if (!checksum(String.join("\n", tokens)).equals(lines.get(2).substring(7))) {
      throw new IOException("vocabulary file " + file + " fails its checksum (corrupt or edited)");
    }
    if (size < 4 || !tokens.subList(0, 4).equals(List.of(PAD, UNK, START, END))) {
      throw new IOException("vocabulary file " + file + " lacks the reserved tokens in their places");
    }
    return new Vocabulary(tokens);
  }

  private static String checksum(String body) {
    return HexFormat.of().formatHex(AtomicFiles.sha256().digest(body.getBytes(StandardCharsets.UTF_8)));
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof Vocabulary v && v.tokens.equals(tokens);
  }

  @Override
  public int hashCode() {
    return tokens.hashCode();
  }
}
