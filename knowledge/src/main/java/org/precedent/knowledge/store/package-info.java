/**
 * The data directory and the stored knowledge in it. {@link org.precedent.knowledge.store.DataDir}
 * knows the directory's top level ({@code knowledge/}, {@code models/}), holds its lock and keeps the
 * numbered generations of knowledge, {@code CURRENT} naming the one in force and replaced atomically;
 * {@link org.precedent.knowledge.store.Knowledge} reads and writes one generation ({@code
 * tickets.jsonl}, {@code groups.json}, {@code manifest.json} written last, and the {@code index/}
 * directory, which it places but does not fill: the index is written by the {@code
 * Knowledge.IndexBuilder} it is handed). The package depends on {@code knowledge.ticket}, {@code
 * knowledge.group}, {@code knowledge.io} and Jackson only; in particular not on {@code
 * knowledge.retrieve}, which depends on it.
 */
package org.precedent.knowledge.store;
