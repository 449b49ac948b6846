/**
 * The dense leg's learnt part: {@link org.precedent.engine.dense.AnswerClassifier}, a multinomial
 * logistic regression from a question's frozen sentence-encoder vector to its answer group, fitted
 * by {@code train} and saved in the model version. The vectors themselves come from {@code
 * knowledge.embed} and live in the knowledge's index ({@code knowledge.retrieve}). It depends on
 * ND4J (the fit's matrix products), Jackson, {@code engine.rerank} (the model-load error) and
 * {@code knowledge.io}.
 */
package org.precedent.engine.dense;
