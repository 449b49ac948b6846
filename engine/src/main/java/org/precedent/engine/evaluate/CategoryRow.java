package org.precedent.engine.evaluate;

/**
 * How one system did on the tickets of one category, at the threshold its {@link CategoryTable}
 * names. Categories can differ a lot: a threshold that is safe overall may not be safe for each one.
 *
 * @param category  the category name, as found in the data
 * @param tickets   tickets of this category
 * @param inScope   of those, tickets that have a right past answer
 * @param top1      share of the in-scope ones whose right answer was ranked first; NaN if none
 * @param answered  tickets that would have been answered automatically at the threshold
 * @param coverage  answered / tickets
 * @param precision share of those replies that were right; NaN when nothing was answered
 * @param serviceAnswered  tickets the service would have answered: the same, less those the
 *                         safety gate hands to a person
 * @param serviceCoverage  serviceAnswered / tickets
 * @param servicePrecision share of those replies that were right; NaN when nothing was answered
 * @param safetyHandOffs   answered - serviceAnswered: tickets the safety gate stopped
 */
public record CategoryRow(String category, int tickets, int inScope, double top1, int answered,
    double coverage, double precision, int serviceAnswered, double serviceCoverage,
    double servicePrecision, int safetyHandOffs) {}
