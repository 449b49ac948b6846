/**
 * General file and console helpers with no knowledge of tickets: {@link
 * org.precedent.knowledge.io.AtomicFiles} writes a file by temporary file, fsync and rename, keeps
 * what it writes private to its owner (600 and 700) and computes SHA-256 checksums; {@link
 * org.precedent.knowledge.io.Progress} prints a rate-limited progress line for long work. Both are used
 * throughout the three modules, which is why they live here rather than in a domain package. The
 * package depends on the JDK alone and on no other package of Precedent.
 */
package org.precedent.knowledge.io;
