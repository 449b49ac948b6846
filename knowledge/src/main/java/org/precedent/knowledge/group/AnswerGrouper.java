package org.precedent.knowledge.group;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.TreeMap;
import java.util.function.Function;
import java.util.stream.Collectors;
import org.precedent.knowledge.ticket.Ticket;

/**
 * Forms answer groups from past tickets.
 *
 * <p>With a label column, the labels are the groups. Without one, replies that reuse one answer are
 * found by near-duplicate detection: word 3-gram shingles, MinHash signatures with locality-sensitive
 * hashing to find candidate pairs (Broder 1997; Leskovec, Rajaraman and Ullman, "Mining of Massive
 * Datasets", ch. 3), each pair confirmed by its exact Jaccard similarity against {@link #threshold},
 * then single-linkage clusters. Clusters that resolved fewer than {@link #minSupport} tickets are
 * one-offs: kept for agents to read, never proposed as automatic replies.
 */
public final class AnswerGrouper {
  /**
   * Exact Jaccard similarity of word 3-gram sets above which two replies are the same answer.
   * Chosen on the demo data (DEVELOPERS.md shows the measurement): an edited reply (a sentence
   * dropped or added, a word changed) keeps 0.6-0.9 of its shingles, different answers share under
   * 0.1.
   */
  public static final double DEFAULT_THRESHOLD = 0.5;
  /** An answer used fewer times than this is a one-off (common practice, no source). */
  public static final int DEFAULT_MIN_SUPPORT = 3;

  private static final int HASHES = 128;
  /** 32 bands of 4 rows: pairs above about (1/32)^(1/4) = 0.42 Jaccard collide in some band. */
  private static final int BANDS = 32;
  private static final int ROWS = HASHES / BANDS;

  private final double threshold;
  private final int minSupport;

  public AnswerGrouper(double threshold, int minSupport) {
    if (!(threshold > 0 && threshold <= 1)) {
      throw new IllegalArgumentException("threshold must be in (0, 1], got " + threshold);
    }
    if (minSupport < 1) {
      throw new IllegalArgumentException("minSupport must be at least 1, got " + minSupport);
    }
    this.threshold = threshold;
    this.minSupport = minSupport;
  }

  public static AnswerGrouper standard() {
    return new AnswerGrouper(DEFAULT_THRESHOLD, DEFAULT_MIN_SUPPORT);
  }

  public double threshold() {
    return threshold;
  }

  public int minSupport() {
    return minSupport;
  }

  public Grouping group(List<Ticket> tickets) {
    boolean labelled = tickets.stream().anyMatch(t -> t.label() != null);
    return labelled ? byLabel(tickets) : bySimilarity(tickets);
  }

  /** The group whose canonical answer a reply reuses (Jaccard at or above the threshold), if any. */
  public Optional<AnswerGroup> match(Grouping grouping, String cleanedReply) {
    return matcher(grouping).apply(cleanedReply);
  }

  /**
   * {@link #match} for many replies against one grouping: the canonical answers' shingles are
   * computed once.
   */
  public java.util.function.Function<String, Optional<AnswerGroup>> matcher(Grouping grouping) {
    List<AnswerGroup> groups = grouping.groups();
    List<long[]> canonical = groups.stream().map(g -> Shingles.of(g.canonical())).toList();
    return cleanedReply -> {
      long[] shingles = Shingles.of(cleanedReply);
      AnswerGroup best = null;
      double bestScore = threshold;
      for (int i = 0; i < groups.size(); i++) {
        double score = Shingles.jaccard(shingles, canonical.get(i));
        if (score >= bestScore) {
          best = groups.get(i);
          bestScore = score;
        }
      }
      return Optional.ofNullable(best);
    };
  }

  private Grouping byLabel(List<Ticket> tickets) {
    Map<String, List<Ticket>> byLabel = new TreeMap<>();
    List<String> oneOffs = new ArrayList<>();
    for (Ticket t : tickets) {
      if (t.label() == null) {
        oneOffs.add(t.id());
      } else {
        byLabel.computeIfAbsent(t.label(), k -> new ArrayList<>()).add(t);
      }
    }
    List<AnswerGroup> groups = new ArrayList<>();
    byLabel.forEach((label, members) -> groups.add(build(label, label, members)));
    return finish(groups, oneOffs, "label column");
  }

  private Grouping bySimilarity(List<Ticket> tickets) {
    // Replies equal once case and punctuation are ignored are one text: cluster distinct texts only.
    Map<String, List<Ticket>> byText = new LinkedHashMap<>();
    for (Ticket t : tickets) {
      byText.computeIfAbsent(String.join(" ", Shingles.words(t.reply())), k -> new ArrayList<>())
          .add(t);
    }
    List<String> texts = new ArrayList<>(byText.keySet());
    long[][] shingles = new long[texts.size()][];
    for (int i = 0; i < texts.size(); i++) {
      shingles[i] = Shingles.of(texts.get(i));
    }
    UnionFind clusters = new UnionFind(texts.size());
    long[] seeds = seeds();
    Map<Long, Integer> firstInBucket = new HashMap<>();
    for (int band = 0; band < BANDS; band++) {
      firstInBucket.clear();
      for (int i = 0; i < texts.size(); i++) {
        long key = band;
        for (int r = 0; r < ROWS; r++) {
          key = Shingles.mix(key * 31 + minHash(shingles[i], seeds[band * ROWS + r]));
        }
        Integer first = firstInBucket.putIfAbsent(key, i);
        // Comparing with the bucket's first member keeps the work linear; members similar to each
        // other but not to the first are joined through another band in practice.
        if (first != null && clusters.find(first) != clusters.find(i)
            && Shingles.jaccard(shingles[first], shingles[i]) >= threshold) {
          clusters.union(first, i);
        }
      }
    }
    Map<Integer, List<Ticket>> members = new TreeMap<>();
    for (int i = 0; i < texts.size(); i++) {
      members.computeIfAbsent(clusters.find(i), k -> new ArrayList<>()).addAll(byText.get(texts.get(i)));
    }
    List<AnswerGroup> groups = new ArrayList<>();
    List<String> oneOffs = new ArrayList<>();
    for (List<Ticket> cluster : members.values()) {
      if (cluster.size() < minSupport) {
        cluster.forEach(t -> oneOffs.add(t.id()));
      } else {
        groups.add(build(null, null, cluster));
      }
    }
    return finish(groups, oneOffs, String.format(java.util.Locale.ROOT,
        "reply similarity (word %d-gram Jaccard >= %.2f, at least %d tickets)",
        Shingles.WORDS, threshold, minSupport));
  }

  private static AnswerGroup build(String id, String label, List<Ticket> members) {
    String canonical = mostFrequent(members.stream().map(Ticket::reply).toList(),
        Comparator.comparingInt(String::length).thenComparing(Function.identity()));
    String category = mostFrequent(members.stream().map(Ticket::category)
        .filter(Objects::nonNull).toList(), Comparator.naturalOrder());
    List<String> ids = members.stream().map(Ticket::id).sorted().toList();
    String template = Slots.of(canonical, members.stream().map(Ticket::reply).toList())
        .orElse(null);
    return new AnswerGroup(id != null ? id : idFor(canonical), canonical, label, category, ids,
        template);
  }

  private static Grouping finish(List<AnswerGroup> groups, List<String> oneOffs, String method) {
    groups.sort(Comparator.comparingInt(AnswerGroup::size).reversed()
        .thenComparing(AnswerGroup::id));
    oneOffs.sort(Comparator.naturalOrder());
    return new Grouping(groups, oneOffs, method);
  }

  /** The most frequent value; ties broken by {@code tieBreak} so that the result is deterministic. */
  private static String mostFrequent(List<String> values, Comparator<String> tieBreak) {
    Map<String, Long> counts = values.stream()
        .collect(Collectors.groupingBy(Function.identity(), Collectors.counting()));
    return counts.entrySet().stream()
        .min(Comparator.<Map.Entry<String, Long>>comparingLong(e -> -e.getValue())
            .thenComparing(Map.Entry::getKey, tieBreak))
        .map(Map.Entry::getKey).orElse(null);
  }

  static String idFor(String canonical) {
    try {
      byte[] digest = MessageDigest.getInstance("SHA-256")
          .digest(String.join(" ", Shingles.words(canonical)).getBytes(StandardCharsets.UTF_8));
      return "a-" + HexFormat.of().formatHex(digest, 0, 5);
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("SHA-256 is required of every Java platform", e);
    }
  }

  private static long[] seeds() {
    long[] seeds = new long[HASHES];
    long z = 0x5eed;
    for (int i = 0; i < HASHES; i++) {
      z += 0x9e3779b97f4a7c15L;
      seeds[i] = Shingles.mix(z);
    }
    return seeds;
  }

  private static long minHash(long[] shingles, long seed) {
    long min = Long.MAX_VALUE;
    for (long s : shingles) {
      min = Math.min(min, Shingles.mix(s ^ seed));
    }
    return min;
  }

  private static final class UnionFind {
    private final int[] parent;

    UnionFind(int n) {
      parent = new int[n];
      for (int i = 0; i < n; i++) {
        parent[i] = i;
      }
    }

    int find(int i) {
      while (parent[i] != i) {
        parent[i] = parent[parent[i]];
        i = parent[i];
      }
      return i;
    }

    void union(int a, int b) {
      int ra = find(a);
      int rb = find(b);
      if (ra != rb) {
        parent[Math.max(ra, rb)] = Math.min(ra, rb);
      }
    }
  }
}
