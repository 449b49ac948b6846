/**
 * A pretrained sentence encoder run in-process on the CPU: {@link
 * org.precedent.knowledge.embed.SentenceEncoder} turns a text into a unit vector (bge-small-en-v1.5,
 * quantized, through ONNX Runtime, with the model's own Hugging Face tokenizer), and names what it
 * runs by an {@link org.precedent.knowledge.embed.SentenceEncoder.Identity} (model name and SHA-256
 * of the model file) so a stored generation can later record which encoder made its vectors. {@link
 * org.precedent.knowledge.embed.NativeLibraries} decides where the two native libraries are unpacked.
 * The package depends on ONNX Runtime, DJL's tokenizers and {@code knowledge.io}; nothing else of
 * Precedent depends on it yet but the {@code benchmark encoder} command (the dense retrieval leg is
 * the next step).
 */
package org.precedent.knowledge.embed;
