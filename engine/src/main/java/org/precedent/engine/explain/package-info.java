/**
 * The shape every explanation takes: a tree of named contributions ({@link
 * org.precedent.engine.explain.Explanation}). Depends on nothing; fusion and the decision stage
 * build such trees, the service and the command line show them.
 */
package org.precedent.engine.explain;
