package org.precedent.knowledge.group;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * Word shingles of a reply: the set of its overlapping word n-grams, hashed to 64 bits and sorted.
 *
 * <p>Words are lower-cased runs of letters and digits, so punctuation and spacing edits do not
 * count as changes. Texts shorter than n words are one shingle of all their words.
 */
final class Shingles {
  /** Word 3-grams: long enough that answers sharing common phrases stay apart (common practice). */
  static final int WORDS = 3;

  private Shingles() {}

  static List<String> words(String text) {
    List<String> words = new ArrayList<>();
    for (String w : text.toLowerCase(Locale.ROOT).split("[^\\p{L}\\p{N}]+")) {
      if (!w.isEmpty()) {
        words.add(w);
      }
    }
    return words;
  }

  /** Sorted distinct shingle hashes of a text. */
  static long[] of(String text) {
    List<String> words = words(text);
    int n = Math.max(1, words.size() - WORDS + 1);
    long[] hashes = new long[n];
    for (int i = 0; i < n; i++) {
      long h = 0xcbf29ce484222325L;
      for (int j = i; j < Math.min(words.size(), i + WORDS); j++) {
        h = fnv(h, words.get(j));
        h = (h ^ ' ') * 0x100000001b3L;
      }
      hashes[i] = mix(h);
    }
    return Arrays.stream(hashes).sorted().distinct().toArray();
  }

  /** Jaccard similarity |A ∩ B| / |A ∪ B| of two sorted distinct sets. */
  static double jaccard(long[] a, long[] b) {
    int i = 0;
    int j = 0;
    int common = 0;
    while (i < a.length && j < b.length) {
      if (a[i] == b[j]) {
        common++;
        i++;
        j++;
      } else if (a[i] < b[j]) {
        i++;
      } else {
        j++;
      }
    }
    int union = a.length + b.length - common;
    return union == 0 ? 1.0 : common / (double) union;
  }

  private static long fnv(long h, String word) {
    for (int k = 0; k < word.length(); k++) {
      h = (h ^ word.charAt(k)) * 0x100000001b3L;
    }
    return h;
  }

  /** A final avalanche (SplitMix64's) so that MinHash permutations see well-spread values. */
  static long mix(long z) {
    z = (z ^ (z >>> 30)) * 0xbf58476d1ce4e5b9L;
    z = (z ^ (z >>> 27)) * 0x94d049bb133111ebL;
    return z ^ (z >>> 31);
  }
}
