/**
 * The dense leg's learnt part and what decisions need of it: {@link
 * org.precedent.engine.dense.AnswerClassifier}, a multinomial logistic regression from a question's
 * frozen sentence-encoder vector to its answer group, fitted by {@code train} and saved in the
 * model version, and {@link org.precedent.engine.dense.DenseLeg}, that classifier with the encoder
 * that embeds new questions. The vectors themselves come from {@code knowledge.embed} and live in
 * the knowledge's index ({@code knowledge.retrieve}). It depends on ND4J (the fit's matrix
 * products), Jackson, {@code engine.rerank} (the model-load error), {@code knowledge.embed},
 * {@code knowledge.store} (the manifest) and {@code knowledge.io}.
 */
package org.precedent.engine.dense;
