package org.precedent.engine.evaluate;

import java.util.ArrayList;
import java.util.List;

/** Thins long curves for the report. */
final class Curves {
  private Curves() {}

  /**
   * At most {@code max} points picked evenly by position. The first point (strictest threshold) and
   * the last (everything answered) are always kept, since the ends are what a reader checks first.
   */
  static <T> List<T> downsample(List<T> points, int max) {
    if (max < 2) {
      throw new IllegalArgumentException("keeping both ends needs at least 2 points; got " + max);
    }
    int n = points.size();
    if (n <= max) {
      return List.copyOf(points);
    }
    List<T> out = new ArrayList<>(max);
    for (int i = 0; i < max; i++) {
      // n > max, so consecutive picks differ by at least one position: no duplicates.
      long index = Math.round((double) i * (n - 1) / (max - 1));
      out.add(points.get((int) index));
    }
    return List.copyOf(out);
  }
}
