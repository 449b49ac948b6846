/**
 * Text to tokens and tokens to ids for the reranker: {@link
 * org.precedent.engine.rerank.tokens.Tokenizer}, a hand-written scanner that runs in time linear in
 * the text and keeps redaction placeholders whole, and {@link
 * org.precedent.engine.rerank.tokens.Vocabulary}, a model's fixed token list with its reserved ids,
 * saved as {@code vocab.txt}. The package depends on the JDK and on {@code knowledge.io} (atomic
 * writes and SHA-256) only; every other reranker package may depend on it.
 */
package org.precedent.engine.rerank.tokens;
