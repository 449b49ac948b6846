/**
 * Model versions over HTTP: {@link org.precedent.api.models.ModelsController} lists the versions,
 * switches to one or back to the one before (for managers, each switch audited with its reason), and
 * the switch takes effect for the next request while requests in flight finish on their model.
 * {@link org.precedent.api.models.Activations} is the rule every activation follows (the
 * comparison {@code evaluate} kept of the version with the one in force, an acknowledgement for a
 * worse or uncompared version), and {@link org.precedent.api.models.ModelAudit} the command
 * line's door to the same audit table. It depends on {@code api.system} ({@code InForceHolder},
 * the audit columns, the schema, the shared rows), {@code engine.evaluate} (the comparison),
 * {@code engine.measure}, {@code engine.rerank} (the model store), {@code knowledge.store},
 * {@code knowledge.io}, Spring Web and Spring JDBC; the command line depends on it.
 */
package org.precedent.api.models;
