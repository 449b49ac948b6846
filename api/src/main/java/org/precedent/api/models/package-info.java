/**
 * Model versions over HTTP: {@link org.precedent.api.models.ModelsController} lists the versions,
 * switches to one or back to the one before (for managers, each switch audited with its reason), and
 * the switch takes effect for the next request while requests in flight finish on their model. It
 * depends on {@code api.system} ({@code ModelHolder}, the audit columns), Spring Web and Spring JDBC;
 * nothing depends on it.
 */
package org.precedent.api.models;
