/**
 * Reading a help desk's export of resolved tickets into stored knowledge: {@link
 * org.precedent.knowledge.ingest.ExportReader} reads CSV (RFC 4180, via commons-csv) or JSON Lines
 * (via Jackson) strictly as UTF-8, {@link org.precedent.knowledge.ingest.ColumnMapping} says which
 * column holds what, {@link org.precedent.knowledge.ingest.RowValidator} turns each row into a cleaned
 * ticket or into {@link org.precedent.knowledge.ingest.RowProblem}s naming file, line and field, and
 * {@link org.precedent.knowledge.ingest.Ingestor} merges the tickets with what is stored, regroups them
 * and writes a new generation with its index. It is the top of the knowledge module and may depend on
 * every other knowledge package ({@code ticket}, {@code clean}, {@code group}, {@code store},
 * {@code retrieve} for the index builder, {@code io}), on commons-csv and Jackson; nothing in the
 * knowledge module depends on it.
 */
package org.precedent.knowledge.ingest;
