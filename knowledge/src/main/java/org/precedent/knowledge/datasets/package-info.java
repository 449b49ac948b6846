/**
 * Readers of the open datasets Precedent is measured on, read in place from the shared datasets
 * folder (never copied into the repository): {@link org.precedent.knowledge.datasets.Clinc150}, the
 * CLINC150 intent dataset, for the tests and the command line's benchmark. The package depends on
 * {@code knowledge.ticket}, {@code knowledge.clean} and Jackson.
 */
package org.precedent.knowledge.datasets;
