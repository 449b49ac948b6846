/**
 * The project's measured figures and the check that a run reproduces them: {@link
 * org.precedent.engine.figures.ExpectedFigures} (each figure with its tolerance, the one source of
 * the figures DEVELOPERS.md shows), {@link org.precedent.engine.figures.MeasuredFigures} (a run's
 * figures, taken from its evaluation report and training metrics), {@link
 * org.precedent.engine.figures.FigureCheck} (measured against expected) and {@link
 * org.precedent.engine.figures.FigureDocs} (the expected values written into Markdown at their
 * markers), all read and written as JSON by {@link org.precedent.engine.figures.FigureFiles}. It
 * depends on {@code engine.evaluate}, {@code engine.decide} (the system names), {@code
 * engine.measure}, {@code engine.rerank} (training metrics), {@code knowledge.io} and Jackson; only
 * the command line's {@code benchmark figures} depends on it.
 */
package org.precedent.engine.figures;
