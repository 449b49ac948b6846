/**
 * Answer groups: which past tickets were resolved by the same reusable answer. {@link
 * org.precedent.knowledge.group.AnswerGrouper} takes the groups from a label column when there is
 * one, and otherwise finds near-duplicate replies (word 3-gram {@link
 * org.precedent.knowledge.group.Shingles}, MinHash with locality-sensitive hashing, exact Jaccard of
 * at least 0.5, single-linkage clusters of at least 3 tickets); tickets in no group are one-offs. The
 * result is the {@link org.precedent.knowledge.group.Grouping} record, stored with each generation.
 * The package depends on {@code knowledge.ticket} and the JDK only (SHA-256 from
 * {@code java.security} for stable group ids); the store, retrieval and the engine depend on it.
 */
package org.precedent.knowledge.group;
