/**
 * Triage of a file of new tickets into JSON Lines decisions, resumable after a crash at any moment:
 * {@link org.precedent.api.triage.TriageRun} appends and forces lines to disk in batches and records
 * each batch in {@link org.precedent.api.triage.TriageProgress} (written atomically), so a rerun cuts
 * a torn tail and goes on with the next ticket. The tickets are read by {@code knowledge.ingest} by
 * the rules ingest reads resolved ones by, already cleaned, and decided as they are. It depends on
 * {@code engine.decide} (the pipeline and its decisions), {@code api.decision} (the decision's view), {@code knowledge.ingest}, {@code
 * knowledge.io} and Jackson; only the command line's {@code triage} uses it.
 */
package org.precedent.api.triage;
