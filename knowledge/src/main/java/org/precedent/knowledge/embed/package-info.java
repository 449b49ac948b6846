/**
 * A pretrained sentence encoder run in-process on the CPU: {@link
 * org.precedent.knowledge.embed.SentenceEncoder} turns a text into a unit vector (bge-small-en-v1.5,
 * quantized, through ONNX Runtime, with the model's own Hugging Face tokenizer), and names what it
 * runs by an {@link org.precedent.knowledge.embed.SentenceEncoder.Identity} (model name and SHA-256
 * of the model file) so a stored generation can later record which encoder made its vectors. {@link
 * org.precedent.knowledge.embed.NativeLibraries} decides where the two native libraries are unpacked.
 * {@link org.precedent.knowledge.embed.Encoders} reads which encoder is chosen, and {@link
 * org.precedent.knowledge.embed.QuestionVectors} embeds the questions of a new generation, taking
 * over the vectors the previous one holds. The package depends on ONNX Runtime, DJL's tokenizers,
 * {@code knowledge.ticket} and {@code knowledge.io}; ingest and retrieval use it.
 */
package org.precedent.knowledge.embed;
