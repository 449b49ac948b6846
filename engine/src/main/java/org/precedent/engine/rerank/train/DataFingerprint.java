package org.precedent.engine.rerank.train;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.List;
import org.precedent.engine.rerank.TrainingPair;
import org.precedent.knowledge.io.AtomicFiles;

/** SHA-256 of the training pairs in order: ties a model or checkpoint to the exact data it learned from. */
public final class DataFingerprint {

  private DataFingerprint() {}

  public static String of(List<TrainingPair> pairs) {
    MessageDigest digest = AtomicFiles.sha256();
    for (TrainingPair p : pairs) {
      // Separators that cannot occur in UTF-8 text keep ("ab","c") and ("a","bc") apart.
      digest.update(p.question().getBytes(StandardCharsets.UTF_8));
      digest.update((byte) 0xFE);
      digest.update(p.answer().getBytes(StandardCharsets.UTF_8));
      digest.update((byte) 0xFF);
    }
    return HexFormat.of().formatHex(digest.digest());
  }
}
