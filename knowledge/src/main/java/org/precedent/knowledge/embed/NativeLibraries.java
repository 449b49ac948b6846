package org.precedent.knowledge.embed;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import org.precedent.knowledge.io.AtomicFiles;

/**
 * Where the encoder's two native libraries are unpacked, and how to move them.
 *
 * <p>Both come inside their jars and are written to disk on first use, because a shared library
 * cannot be loaded from inside a jar:
 *
 * <ul>
 *   <li>ONNX Runtime ({@code ai.onnxruntime.OnnxRuntime}) copies {@code libonnxruntime} and {@code
 *       libonnxruntime4j_jni} into a fresh {@code onnxruntime-java*} folder under {@code
 *       java.io.tmpdir} (usually {@code /tmp}) on every start, its files deleted at exit and the
 *       empty folder left (seen on this project's machine, ONNX Runtime 1.23.2); with the system
 *       property {@code onnxruntime.native.path} set it loads them from that folder instead and
 *       unpacks nothing.
 *   <li>DJL's tokenizers ({@code ai.djl.huggingface.tokenizers.jni.LibUtils}) copy {@code
 *       libtokenizers} once into {@code ~/.djl.ai/tokenizers/VERSION-cpu-PLATFORM/} and keep it; the
 *       environment variable or system property {@code DJL_CACHE_DIR} (or {@code ENGINE_CACHE_DIR})
 *       moves that folder, and {@code RUST_LIBRARY_PATH} names an already unpacked library.
 * </ul>
 *
 * <p>Precedent's own setting, the system property {@value #PROPERTY} (documented in README.md),
 * moves both under one folder: ONNX Runtime's libraries are unpacked once into {@code
 * DIR/onnxruntime-VERSION/} (temporary file and rename, so two processes starting together do not see
 * a half-written library) and {@code onnxruntime.native.path} is pointed there; DJL's cache goes to
 * {@code DIR/djl}. A setting the user made directly for either library is left as it is. Without the
 * property DIR is {@code ~/.precedent/native}: unpacked once and kept, rather than copied into the
 * system temp folder on every start (where a start-up pays for the copy and a full temp folder
 * stops the encoder).
 */
final class NativeLibraries {
  /** The system property naming the folder for unpacked native libraries. */
  static final String PROPERTY = "precedent.native.dir";

  private static final String ORT_PATH = "onnxruntime.native.path";
  private static boolean prepared;

  private NativeLibraries() {}

  /** Applies {@value #PROPERTY}, once per process, before either library is first loaded. */
  static synchronized void prepare() {
    if (prepared) {
      return;
    }
    String configured = System.getProperty(PROPERTY);
    Path dir = (configured == null || configured.isBlank() ? defaultDirectory()
        : Path.of(configured)).toAbsolutePath();
    if (System.getProperty("DJL_CACHE_DIR") == null && System.getenv("DJL_CACHE_DIR") == null
        && System.getProperty("ENGINE_CACHE_DIR") == null
        && System.getenv("ENGINE_CACHE_DIR") == null) {
      System.setProperty("DJL_CACHE_DIR", dir.resolve("djl").toString());
    }
    if (System.getProperty(ORT_PATH) == null) {
      Path ort = unpackOnnxRuntime(dir);
      if (ort != null) {
        System.setProperty(ORT_PATH, ort.toString());
      }
    }
    prepared = true;
  }

  /** {@code ~/.precedent/native}, the folder used when {@value #PROPERTY} is not set. */
  static Path defaultDirectory() {
    return Path.of(System.getProperty("user.home"), ".precedent", "native");
  }

  /**
   * Unpacks ONNX Runtime's libraries for this platform into {@code dir/onnxruntime-VERSION}; null when
   * its jar has none for this platform (ONNX Runtime then reports the platform itself).
   */
  private static Path unpackOnnxRuntime(Path dir) {
    String platform = ortPlatform();
    String version = ai.onnxruntime.OrtEnvironment.class.getPackage().getImplementationVersion();
    Path target = dir.resolve("onnxruntime-" + (version == null ? "unknown" : version));
    try {
      for (String name : new String[] {"onnxruntime", "onnxruntime4j_jni"}) {
        String file = System.mapLibraryName(name);
        String resource = "/ai/onnxruntime/native/" + platform + "/" + file;
        try (InputStream in = ai.onnxruntime.OrtEnvironment.class.getResourceAsStream(resource)) {
          if (in == null) {
            return null;
          }
          Path lib = target.resolve(file);
          if (!Files.isRegularFile(lib)) {
            AtomicFiles.write(lib, out -> in.transferTo(out));
          }
        }
      }
      return target;
    } catch (IOException e) {
      throw new UncheckedIOException("cannot unpack ONNX Runtime's native libraries into " + target
          + " (set by " + PROPERTY + ")", e);
    }
  }

  /** ONNX Runtime's name for this platform, as its jar lays out {@code ai/onnxruntime/native/}. */
  private static String ortPlatform() {
    String os = System.getProperty("os.name", "").toLowerCase(Locale.ROOT);
    String arch = System.getProperty("os.arch", "").toLowerCase(Locale.ROOT);
    String o = os.contains("mac") || os.contains("darwin") ? "osx"
        : os.contains("win") ? "win" : "linux";
    String a = arch.equals("aarch64") || arch.equals("arm64") ? "aarch64" : "x64";
    return o + "-" + a;
  }
}
