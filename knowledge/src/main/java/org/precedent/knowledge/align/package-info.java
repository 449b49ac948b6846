/**
 * Alignment of token sequences: {@link org.precedent.knowledge.align.GlobalAlignment} lines up two
 * sequences end to end (Needleman and Wunsch 1970) under any scoring of pairs and a linear gap
 * penalty. It knows nothing of tickets, so answer groups can use it to find where their replies
 * differ. The package depends on the JDK alone and on no other package of Precedent.
 */
package org.precedent.knowledge.align;
