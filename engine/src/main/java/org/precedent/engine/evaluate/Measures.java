package org.precedent.engine.evaluate;

/**
 * The headline measures of one system. NaN marks a measure that is undefined on this data (for
 * example ranking measures with no in-scope ticket, or AUROC when every reply was right).
 *
 * @param top1                     share of in-scope tickets whose right answer was ranked first
 * @param meanReciprocalRank       mean of 1/rank over in-scope tickets, 0 when absent
 * @param recallAt1                share of in-scope tickets with the right answer in the first 1
 * @param recallAt5                ... in the first 5
 * @param recallAt10               ... in the first 10
 * @param recallAt20               ... in the first 20
 * @param expectedCalibrationError ECE over all tickets with 15 equal-width bins
 * @param brierScore               mean squared gap between confidence and a right reply, all tickets
 * @param auroc                    chance a right reply out-scores a wrong one
 * @param aurc                     area under the risk-coverage curve; lower is better
 * @param coverageAt90             largest share answered with measured precision >= 90%
 * @param coverageAt95             ... >= 95%
 * @param coverageAt99             ... >= 99%
 */
public record Measures(
    double top1,
    double meanReciprocalRank,
    double recallAt1,
    double recallAt5,
    double recallAt10,
    double recallAt20,
    double expectedCalibrationError,
    double brierScore,
    double auroc,
    double aurc,
    double coverageAt90,
    double coverageAt95,
    double coverageAt99) {}
