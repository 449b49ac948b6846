/**
 * Short addresses for the web pages ({@code /}, {@code /answers}, {@code /manage}), forwarded to
 * the static files under {@code /pages/} by {@link org.precedent.api.pages.PageRoutes}; the pages
 * call the API from the browser, so nothing is rendered on the server. It depends on Spring Web only,
 * and on no other package of Precedent.
 */
package org.precedent.api.pages;
