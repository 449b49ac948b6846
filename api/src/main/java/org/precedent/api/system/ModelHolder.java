package org.precedent.api.system;

import java.io.IOException;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.atomic.AtomicReference;
import org.precedent.engine.decide.ActiveModel;
import org.precedent.engine.decide.Thresholds;
import org.precedent.engine.rerank.ModelLoadException;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.knowledge.store.DataDir;

/**
 * Holds the model the service decides with and swaps it atomically. A request takes a lease on what
 * is in force and finishes on it; a swap installs the new advisor for later requests and lets the old
 * model close once its last lease is returned. Swaps are serialised with each other.
 */
public final class ModelHolder implements AutoCloseable {
  private final DataDir dataDir;
  private final AtomicReference<Served> current = new AtomicReference<>();
  private final Object swapLock = new Object();
  // The model reads the thresholds once when opened; later changes live here and in the file.
  private final AtomicReference<Thresholds> thresholdsInForce = new AtomicReference<>();

  public ModelHolder(DataDir dataDir) throws IOException {
    this.dataDir = dataDir;
    ActiveModel model;
    try {
      model = ActiveModel.open(dataDir);
    } catch (ModelLoadException e) {
      // Refused rather than served in part: a damaged or edited version decides nothing.
      throw new ModelLoadException("the model version in force ("
          + store().activeVersion().orElse("none") + ", named in "
          + dataDir.models().resolve(ModelStore.ACTIVE) + ") cannot be used: " + e.getMessage()
          + ". Train a new version ('precedent train'), or name a sound one in that file", e);
    }
    current.set(new Served(new LoadedModel(model), model.advisor()));
    thresholdsInForce.set(model.thresholds());
  }

  public DataDir dataDir() {
    return dataDir;
  }

  /** A lease on the advisor in force; close it when the request is done. */
  public AdvisorLease lease() {
    while (true) {
      Served s = current.get();
      if (s == null) {
        throw new IllegalStateException("the service is shutting down");
      }
      if (s.loaded().tryRetain()) {
        return new AdvisorLease(s);
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
      ActiveModel.writeThresholds(dataDir, next);
      try {
        after.record(old, next);
      } catch (RuntimeException | IOException e) {
        ActiveModel.writeThresholds(dataDir, old);
        throw e;
      }
      Served s = current.get();
      // Same model, new advisor: the model's use count carries over unchanged.
      current.set(new Served(s.loaded(), s.advisor().withThresholds(next)));
      thresholdsInForce.set(next);
      return old;
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

  public Optional<String> storedActiveVersion() throws IOException {
    return store().activeVersion();
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
      ActiveModel opened;
      try {
        opened = ActiveModel.open(dataDir);
      } catch (IOException | RuntimeException e) {
        store.activate(before);
        throw e;
      }
      Served old = current.getAndSet(new Served(new LoadedModel(opened),
          opened.advisor().withThresholds(thresholdsInForce.get())));
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
