package org.precedent.engine.rerank;

import org.nd4j.linalg.factory.Nd4j;

/**
 * The thread counts ND4J computes with in this process. They are an input of training like the seed:
 * a sum split over two threads is added in another order than over one, so the same data and seed
 * give other weights in their last bits, and after a few epochs another model (measured on this
 * project's machine: the same run with 1 and 2 threads ends on different weights). Each count is
 * fixed when ND4J starts, from {@code OMP_NUM_THREADS} (else the number of cores); the
 * {@code precedent} script sets it to 1.
 *
 * @param operations       threads of ND4J's own operations
 * @param masterOperations threads that may start operations in parallel
 * @param blas             threads of the BLAS library (matrix products)
 */
public record ComputeThreads(int operations, int masterOperations, int blas) {

  public static ComputeThreads current() {
    return new ComputeThreads(Nd4j.getEnvironment().maxThreads(),
        Nd4j.getEnvironment().maxMasterThreads(), Nd4j.factory().blas().getMaxThreads());
  }

  /** As kept in a checkpoint: the three counts separated by commas. */
  public String toText() {
    return operations + "," + masterOperations + "," + blas;
  }

  /** Reads {@link #toText()}. */
  public static ComputeThreads fromText(String text) {
    String[] parts = text.split(",", -1);
    if (parts.length != 3) {
      throw new IllegalArgumentException("compute threads must be three counts, was '" + text + "'");
    }
    try {
      return new ComputeThreads(Integer.parseInt(parts[0].trim()), Integer.parseInt(parts[1].trim()),
          Integer.parseInt(parts[2].trim()));
    } catch (NumberFormatException e) {
      throw new IllegalArgumentException("compute threads must be three counts, was '" + text + "'", e);
    }
  }

  @Override
  public String toString() {
    return operations == masterOperations && operations == blas
        ? operations + (operations == 1 ? " thread" : " threads")
        : "operations " + operations + ", master " + masterOperations + ", BLAS " + blas + " threads";
  }
}
