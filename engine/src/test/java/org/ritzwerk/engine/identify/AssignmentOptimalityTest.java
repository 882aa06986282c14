package org.ritzwerk.engine.identify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.arbitrary;
import static org.quicktheories.generators.SourceDSL.doubles;
import static org.quicktheories.generators.SourceDSL.lists;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;

/**
 * The one-to-one assignment is optimal: on small random crowded scenes (up to 7 peaks and 7
 * lines, QuickTheories, fixed seed) its number of matches and total cost equal those of an
 * exhaustive search over every assignment, for each tolerance model (the absolute one is solved
 * by the non-crossing dynamic programme, the others by the Hungarian method), with and without
 * lines declared blends (which may serve several peaks, but only peaks they can explain together:
 * the exhaustive search keeps the same rule, and the result is checked against it).
 */
class AssignmentOptimalityTest {

    @Test
    void matchesExhaustiveSearch() {
        qt().withFixedSeed(77L).withExamples(400)
                .forAll(lists().of(doubles().between(0, 10)).ofSizeBetween(1, 7),
                        lists().of(doubles().between(0, 10)).ofSizeBetween(1, 7),
                        // below 1: the strength of an ordinary line; from 1: a blend of strength v - 0.95
                        lists().of(doubles().between(0.05, 1.6)).ofSizeBetween(7, 7),
                        arbitrary().pick(List.of(Tolerance.absolute(1.5e-12), Tolerance.relative(3e-12 / 500e-9),
                                Tolerance.kSigma(3))))
                .checkAssert((peakOffsets, lineOffsets, codes, tolerance) -> {
                    LineCatalog.Builder builder = LineCatalog.builder();
                    for (int j = 0; j < lineOffsets.size(); j++) {
                        double code = codes.get(j);
                        if (code >= 1) {
                            // from 1.3: with a spread of its components of 1 pm
                            builder.addBlend(Species.parse("H I"), 500e-9 + lineOffsets.get(j) * 1e-12, 0.3e-12,
                                    code - 0.95, null, code >= 1.3 ? 1e-12 : 0);
                        } else {
                            builder.add(Species.parse("H I"), 500e-9 + lineOffsets.get(j) * 1e-12, 0.3e-12, code, null);
                        }
                    }
                    LineCatalog lines = builder.build();
                    // a peak list holds each peak once (the identifier refuses repeats): offsets that
                    // land on one double are taken once
                    double[] positions = peakOffsets.stream().mapToDouble(d -> 500e-9 + d * 1e-12).distinct()
                            .toArray();
                    double[] sigmas = new double[positions.length];
                    java.util.Arrays.fill(sigmas, 0.4e-12);
                    PeakList peaks = PeakList.ofVacuumMetres(positions, sigmas);
                    Identification result = Identifier.of(tolerance).identify(peaks, lines);
                    int matches = 0;
                    double total = 0;
                    boolean[] used = new boolean[lines.size()];
                    for (int i = 0; i < peaks.size(); i++) {
                        if (result.line(i) >= 0) {
                            matches++;
                            total += result.cost(i);
                            assertEquals(false, used[result.line(i)], "one-to-one");
                            used[result.line(i)] = !lines.isBlend(result.line(i));
                        }
                    }
                    assertTrue(blendsExplainTheirPeaksTogether(peaks, lines, tolerance, result::line), "blend rule");
                    double[] best = {0, Double.POSITIVE_INFINITY};
                    int[] assigned = new int[peaks.size()];
                    search(0, peaks, lines, tolerance, new boolean[lines.size()], assigned, 0, 0, best);
                    assertEquals(best[0], matches, "number of matches");
                    assertEquals(best[1], total, 1e-9 * Math.max(1, best[1]), "total cost");
                });
    }

    /**
     * The blend rule of {@link Identifier}: the shortest and longest peak that one blend explains
     * lie at most the blend's spread plus the tolerance of a difference apart.
     */
    static boolean blendsExplainTheirPeaksTogether(PeakList peaks, LineCatalog lines, Tolerance tolerance,
            java.util.function.IntUnaryOperator lineOf) {
        for (int a = 0; a < peaks.size(); a++) {
            for (int b = 0; b < peaks.size(); b++) {
                int j = lineOf.applyAsInt(a);
                if (a == b || j < 0 || j != lineOf.applyAsInt(b) || peaks.wavelength(a) > peaks.wavelength(b)) {
                    continue;
                }
                double xa = peaks.wavelength(a);
                if (peaks.wavelength(b) - xa > lines.blendSpread(j)
                        + tolerance.halfWidth(xa, peaks.sigma(a), peaks.sigma(b))) {
                    return false;
                }
            }
        }
        return true;
    }

    /**
     * Every assignment of peaks i.. to unused lines or to nothing that keeps the blend rule;
     * best = {matches, cost}. (Before the blend rule, any peaks could share a blend.)
     */
    private static void search(int i, PeakList peaks, LineCatalog lines, Tolerance tolerance, boolean[] used,
            int[] assigned, int matches, double cost, double[] best) {
        if (i == peaks.size()) {
            if ((matches > best[0] || matches == best[0] && cost < best[1])
                    && blendsExplainTheirPeaksTogether(peaks, lines, tolerance, k -> assigned[k])) {
                best[0] = matches;
                best[1] = cost;
            }
            return;
        }
        assigned[i] = -1;
        search(i + 1, peaks, lines, tolerance, used, assigned, matches, cost, best);
        double x = peaks.wavelength(i);
        for (int j = 0; j < lines.size(); j++) {
            double r = x - lines.wavelength(j);
            if (used[j] || Math.abs(r) > tolerance.halfWidth(x, peaks.sigma(i), lines.sigma(j))) {
                continue;
            }
            double s = tolerance.scoringSigma(x, peaks.sigma(i), lines.sigma(j));
            double z = r / s;
            used[j] = !lines.isBlend(j);
            assigned[i] = j;
            search(i + 1, peaks, lines, tolerance, used, assigned, matches + 1,
                    cost + 0.5 * z * z - Identifier.DEFAULT_STRENGTH_WEIGHT * Math.log(lines.strength(j)), best);
            assigned[i] = -1;
            used[j] = false;
        }
    }
}
