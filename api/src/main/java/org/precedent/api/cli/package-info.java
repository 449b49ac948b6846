/**
 * The {@code precedent} command line (picocli): {@link org.precedent.api.cli.PrecedentCommand} and one
 * sub-command per job ({@code ingest}, {@code ask}, {@code train}, {@code evaluate}, {@code
 * activate}, {@code triage},
 * {@code serve}, {@code demo}, and {@code benchmark} with its retrieval, reranker, encoder, CLINC150, service, queue
 * (sign-ins included) and figures runs), and the printers of their output. Errors reach the person as
 * one line saying what and where ({@link org.precedent.api.cli.Messages}). As the outermost layer it
 * may depend on every package below it (the knowledge and engine packages, {@code api.system} to
 * start the service, {@code api.models} and {@code api.answers} for activations and the approval
 * gate's figures, {@code api.threshold}, {@code api.triage}, {@code api.queue} for the queue benchmark, {@code org.precedent.demo}, the demo data generator, for generated text in benchmarks), on
 * picocli, Jackson and Spring's application context; nothing depends on it.
 */
package org.precedent.api.cli;
