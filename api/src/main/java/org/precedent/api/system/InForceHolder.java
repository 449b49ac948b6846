package org.precedent.api.system;

import java.io.IOException;
import java.util.List;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.BooleanSupplier;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.decide.Thresholds;
import org.precedent.engine.rerank.ModelLoadException;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.knowledge.store.DataDir;

/**
 * Holds the model the service decides with and swaps it atomically. A request takes a lease on what
 * is in force and finishes on it; a swap installs the new pipeline for later requests and lets the old
 * model close once its last lease is returned. Swaps are serialised with each other.
 */
public final class InForceHolder implements AutoCloseable {
  private final DataDir dataDir;
  private final AtomicReference<Served> current = new AtomicReference<>();
  private final Object swapLock = new Object();
  // The model reads the thresholds once when opened; later changes live here and in the file.
  private final AtomicReference<Thresholds> thresholdsInForce = new AtomicReference<>();

  public InForceHolder(DataDir dataDir) throws IOException {
    this.dataDir = dataDir;
    InForce model;
    try {
      model = InForce.open(dataDir);
    } catch (ModelLoadException e) {
      // Refused rather than served in part: a damaged or edited version decides nothing.
      throw new ModelLoadException("the model version in force ("
          + store().activeVersion().orElse("none") + ", named in "
          + dataDir.models().resolve(ModelStore.ACTIVE) + ") cannot be used: " + e.getMessage()
          + ". Train a new version ('precedent train'), or name a sound one in that file", e);
    }
    current.set(new Served(new SharedInForce(model), model.pipeline()));
    thresholdsInForce.set(model.thresholds());
  }

  public DataDir dataDir() {
    return dataDir;
  }

  /** A lease on the pipeline in force; close it when the request is done. */
  public PipelineLease lease() {
    while (true) {
      Served s = current.get();
      if (s == null) {
        throw new IllegalStateException("the service is shutting down");
      }
      if (s.loaded().tryRetain()) {
        return new PipelineLease(s);
      }
      // That model closed between reading and retaining: the swap already installed a newer one.
    }
  }

  public String version() {
    return current.get().loaded().model().version();
  }

  public Thresholds thresholds() {
    return thresholdsInForce.get();
  }

  /**
   * Writes new thresholds to the data directory and puts them in force, then runs {@code after}
   * (the audit record) under the same lock; if {@code after} fails, the old thresholds are restored.
   */
  public Thresholds changeThresholds(Thresholds next, ThresholdsChange after) throws IOException {
    synchronized (swapLock) {
      Thresholds old = thresholdsInForce.get();
      InForce.writeThresholds(dataDir, next);
      try {
        after.record(old, next);
      } catch (RuntimeException | IOException e) {
        InForce.writeThresholds(dataDir, old);
        throw e;
      }
      Served s = current.get();
      // Same model, new pipeline: the model's use count carries over unchanged.
      current.set(new Served(s.loaded(), s.pipeline().withThresholds(next)));
      thresholdsInForce.set(next);
      return old;
    }
  }

  /**
   * Puts thresholds another replica changed in force here, without writing the data directory
   * (the replica that made the change wrote it). Nothing happens when they are the ones in force,
   * or when {@code stillNewer}, asked under the lock every change here holds, says a change made
   * here since is newer.
   */
  public boolean adoptThresholds(Thresholds next, BooleanSupplier stillNewer) {
    synchronized (swapLock) {
      if (!stillNewer.getAsBoolean() || next.equals(thresholdsInForce.get())) {
        return false;
      }
      Served s = current.get();
      current.set(new Served(s.loaded(), s.pipeline().withThresholds(next)));
      thresholdsInForce.set(next);
      return true;
    }
  }

  /**
   * Puts in force the version another replica activated, as the shared data directory's {@code
   * ACTIVE} names it, without writing it. Refused (an exception, the version in force stays) when
   * {@code ACTIVE} names another version or the version cannot be opened.
   */
  public boolean adoptVersion(String version) throws IOException {
    synchronized (swapLock) {
      if (version.equals(version())) {
        return false;
      }
      String named = store().activeVersion().orElse("none");
      if (!named.equals(version)) {
        throw new IOException("the database names model version " + version + " in force, but "
            + dataDir.models().resolve(ModelStore.ACTIVE) + " names " + named
            + ": replicas must share one data directory");
      }
      InForce opened = InForce.open(dataDir);
      Served old = current.getAndSet(new Served(new SharedInForce(opened),
          opened.pipeline().withThresholds(thresholdsInForce.get())));
      old.loaded().release();
      return true;
    }
  }

  /** Records a threshold change (the audit), given the old and new thresholds. */
  @FunctionalInterface
  public interface ThresholdsChange {
    void record(Thresholds old, Thresholds next) throws IOException;
  }

  public List<String> versions() throws IOException {
    return store().versions();
  }

  /**
   * Makes {@code version} the active one on disk and in the service. If it cannot be opened, the
   * previous version stays active everywhere and the error is thrown.
   *
   * @return the version that was in force before
   */
  public String activate(String version) throws IOException {
    synchronized (swapLock) {
      ModelStore store = store();
      String before = version();
      store.activate(version);
      InForce opened;
      try {
        opened = InForce.open(dataDir);
      } catch (IOException | RuntimeException e) {
        store.activate(before);
        throw e;
      }
      Served old = current.getAndSet(new Served(new SharedInForce(opened),
          opened.pipeline().withThresholds(thresholdsInForce.get())));
      old.loaded().release();
      return before;
    }
  }

  private ModelStore store() {
    return new ModelStore(dataDir.models());
  }

  @Override
  public void close() {
    synchronized (swapLock) {
      Served s = current.getAndSet(null);
      if (s != null) {
        s.loaded().release();
      }
    }
  }
}
