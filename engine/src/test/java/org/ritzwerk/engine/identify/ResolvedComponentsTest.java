package org.ritzwerk.engine.identify;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.lines.LineQuery;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.lines.LineSources;
import org.ritzwerk.engine.ritz.RitzLevels;

/**
 * A multiplet entered as one blend is seen at its centroid where an instrument does not resolve
 * its components and at each component where it does. A high-resolution He I-like spectrum had
 * its strongest line "unexplained" and listed as missing: the blend was matched only at its
 * centroid, which the multiplet's far J = 0 component (11 % of its strength) pulls 0.004 nm away
 * from the main peak. Invented levels laid out like a He I 3D - 3P triplet (common practice: a
 * triplet term's J splittings; the 3P0 level about 1 cm-1 above 3P1 and 3P2).
 */
class ResolvedComponentsTest {

    private static final Species HE = Species.parse("He I");

    /** The multiplet's catalog: 3D1,2,3 above 3P0,1,2, one blend of six components. */
    private static LineCatalog triplet() {
        RitzLevels levels = RitzLevels.builder(HE)
                .add("1s2p 3P2", 169086.77, 1e-3, -1).add("1s2p 3P1", 169086.84, 1e-3, -1)
                .add("1s2p 3P0", 169087.83, 1e-3, -1)
                .add("1s3d 3D3", 186101.55, 1e-3, -1).add("1s3d 3D2", 186101.56, 1e-3, -1)
                .add("1s3d 3D1", 186101.60, 1e-3, -1).build();
        LineSet lines = LineQuery.defaults().withWindowHz(1e14, 1e15).run(LineSources.none().withLevels(levels));
        LineCatalog catalog = Candidates.inWindow(100e-9, 3000e-9).lineSet(lines).build().catalog();
        assertEquals(1, catalog.size(), "one blend");
        return catalog;
    }

    private static PeakList peaks(double sigma, double... metres) {
        double[] s = new double[metres.length];
        Arrays.fill(s, sigma);
        return PeakList.ofVacuumMetres(metres, s);
    }

    @Test
    void resolvedComponentsAreEachExplainedByTheirMultiplet() {
        LineCatalog catalog = triplet();
        double[] components = catalog.componentPositions(0);
        Arrays.sort(components);
        double farthest = components[components.length - 1]; // 3P0 lies highest: its line is the longest
        double main = components[0];
        assertTrue(farthest - main > 0.03e-9, "the J = 0 component lies apart: " + (farthest - main));
        assertTrue(Math.abs(catalog.wavelength(0) - main) > 0.003e-9, "the centroid is pulled off the main peak");
        // resolved: one peak at the main group, one at the J = 0 component, 0.5 pm each
        PeakList resolved = peaks(0.5e-12, farthest, main);
        Identification result = Identifier.of(Tolerance.kSigma(5)).identify(resolved, catalog);
        for (int i = 0; i < 2; i++) {
            assertEquals(Identification.MATCHED, result.status(i), "peak " + i);
            assertEquals(0, result.line(i));
            // seen at its own group, not at the multiplet's centroid
            assertTrue(Math.abs(result.residual(i)) <= 2.5e-12, "within 5 sigma of its group: " + result.residual(i));
            assertTrue(Math.abs(result.matchedPosition(i) - catalog.wavelength(0)) > 3e-12);
        }
        assertEquals(farthest, result.matchedPosition(0), 1e-18, "the J = 0 component is a group of its own");
        assertEquals(0, result.missingStrongLines().length, "the multiplet is not missing");
        // unresolved: one peak at the centroid
        Identification blended = Identifier.of(Tolerance.kSigma(5)).identify(peaks(1e-12, catalog.wavelength(0)),
                catalog);
        assertEquals(Identification.MATCHED, blended.status(0));
        assertEquals(catalog.wavelength(0), blended.matchedPosition(0), 0);
    }

    @Test
    void aGroupBeyondOneToleranceFromTheRestIsItsOwnPosition() {
        // a review's case: peaks of 5 pm (tolerance 5 sigma, 25 pm) on the main group and on the
        // J = 0 component 34 pm away; the groups parted only at gaps over 2 h = 50 pm, so the far
        // peak, 30 pm (6 sigma) from the centroid, was left unexplained
        LineCatalog catalog = triplet();
        double[] components = catalog.componentPositions(0);
        Arrays.sort(components);
        double farthest = components[components.length - 1];
        double main = components[0];
        double sigma = 5e-12;
        assertTrue(farthest - main > 5 * sigma && farthest - main < 10 * sigma,
                "between h and 2 h: " + (farthest - main));
        assertEquals(3, catalog.positions(0, 5 * sigma).length, "the centroid and two groups");
        Identification result = Identifier.of(Tolerance.kSigma(5)).identify(peaks(sigma, main, farthest), catalog);
        for (int i = 0; i < 2; i++) {
            assertEquals(Identification.MATCHED, result.status(i), "peak " + i);
            assertTrue(Math.abs(result.residual(i)) <= sigma, "at its own group: " + result.residual(i));
        }
        assertEquals(farthest, result.matchedPosition(1), 1e-18);
        // the far component alone, and a peak at the centroid, are matched too
        assertEquals(Identification.MATCHED,
                Identifier.of(Tolerance.kSigma(5)).identify(peaks(sigma, farthest), catalog).status(0));
        assertEquals(Identification.MATCHED,
                Identifier.of(Tolerance.kSigma(5)).identify(peaks(sigma, catalog.wavelength(0)), catalog).status(0));
    }

    @Test
    void aPeakBetweenTheComponentsIsNotExplainedByTheSpanAlone() {
        LineCatalog catalog = triplet();
        double[] components = catalog.componentPositions(0);
        Arrays.sort(components);
        // halfway between the J = 0 component (the longest) and the centroid: 0.015 nm from both
        double between = 0.5 * (components[components.length - 1] + catalog.wavelength(0));
        Identification result = Identifier.of(Tolerance.kSigma(5)).identify(peaks(0.5e-12, between), catalog);
        assertEquals(Identification.UNEXPLAINED, result.status(0));
        // and the wider window of a blend with components counts against chance
        double h = 1e-12;
        assertTrue(catalog.windowLength(0, h) > 4 * h, "its window covers the far component too");
        assertTrue(catalog.windowLength(0, h) <= 2 * h * (components.length + 1));
        // a half-width that cannot tell the components apart: one window, at the centroid
        double wide = 1e-9;
        assertEquals(2 * wide, catalog.windowLength(0, wide), 1e-22);
    }

    @Test
    void aVelocityFromResolvedComponentsIsNotPulledByTheCentroid() {
        // the multiplet beside three single lines of another species; every peak where an
        // instrument resolving the multiplet's groups sees it, moved by 20 km/s
        LineCatalog one = triplet();
        double sigma = 0.5e-12;
        double[] seen = one.positions(0, 5 * sigma);
        assertEquals(3, seen.length, "the centroid and two groups");
        Species ne = Species.parse("Ne I");
        LineCatalog.Builder builder = LineCatalog.builder().add(ne, 540e-9, 0, 1, "a").add(ne, 560e-9, 0, 1, "b")
                .add(ne, 620e-9, 0, 1, "c");
        builder.addBlend(HE, one.wavelength(0), 0, 1, "multiplet", one.componentPositions(0),
                new double[one.componentPositions(0).length]);
        LineCatalog catalog = builder.build();
        double[] groups = catalog.positions(2, 5 * sigma); // 540, 560, the multiplet near 587, 620 nm
        assertTrue(catalog.isBlend(2));
        double z = 20e3 / PhysicalConstants.C;
        PeakList shifted = peaks(sigma, 540e-9 * (1 + z), 560e-9 * (1 + z), groups[1] * (1 + z), groups[2] * (1 + z),
                620e-9 * (1 + z));
        ShiftSearch.Fit fit = ShiftSearch.redshift(Identifier.of(Tolerance.kSigma(5)), shifted, catalog, 100e3);
        // exact positions: the fit must return the shift itself, within rounding
        assertEquals(z, fit.value(), 1e-12, "velocity " + fit.value() * PhysicalConstants.C);
        assertEquals(5, fit.matches());
    }

    @Test
    void theParallelVariantAgreesWithComponents() {
        LineCatalog catalog = triplet();
        double[] components = catalog.componentPositions(0);
        double[] metres = new double[components.length + 1];
        System.arraycopy(components, 0, metres, 0, components.length);
        metres[components.length] = catalog.wavelength(0);
        Arrays.sort(metres);
        PeakList all = peaks(0.3e-12, metres);
        Identifier identifier = Identifier.of(Tolerance.kSigma(5));
        Identification one = identifier.identify(all, catalog);
        Identification parts = identifier.identifyInParallel(all, catalog, 3);
        for (int i = 0; i < all.size(); i++) {
            assertEquals(one.line(i), parts.line(i), "peak " + i);
            assertEquals(one.status(i), parts.status(i), "peak " + i);
        }
    }

    @Test
    void aStrongLineMatchedByTheOutermostPeakCountsAmongTheStrongLines() {
        // three equally strong lines; the last peak lies 0.6 sigma short of its line, so the line
        // lies just beyond the peaks' range (it was dropped from the count: "no strong line")
        Species ne = Species.parse("Ne I");
        LineCatalog catalog = LineCatalog.builder().add(ne, 500e-9, 0, 1, "a").add(ne, 510e-9, 0, 1, "b")
                .add(ne, 520e-9, 0, 1, "c").build();
        Identification result = Identifier.of(Tolerance.kSigma(5))
                .identify(peaks(1e-12, 500e-9, 510e-9, 520e-9 - 0.6e-12), catalog);
        Identification.SpeciesPresence presence = result.speciesPresence().get(0);
        assertEquals(3, presence.strongInRange(), "all three strong lines count");
        assertEquals(3, presence.strongMatched());
        assertArrayEquals(new int[0], result.missingStrongLines());
    }

    @Test
    void anImpreciseLineElsewhereDoesNotMergeTheGroups() {
        // the same multiplet beside a line of another species known only to 7.5 pm: the groups
        // part at each line's own tolerance, not at the least precise line's
        LineCatalog one = triplet();
        LineCatalog.Builder builder = LineCatalog.builder().add(Species.parse("Ne I"), 402.62e-9, 7.5e-12, 1, "vague");
        builder.addBlend(HE, one.wavelength(0), 0, 1, "multiplet", one.componentPositions(0),
                new double[one.componentPositions(0).length]);
        LineCatalog catalog = builder.build();
        double sigma = 0.5e-12;
        double[] groups = catalog.positions(1, 5 * sigma);
        assertEquals(3, groups.length);
        PeakList resolved = peaks(sigma, 402.62e-9, groups[1], groups[2]);
        Identification result = Identifier.of(Tolerance.kSigma(5)).identify(resolved, catalog);
        for (int i = 0; i < 3; i++) {
            assertEquals(Identification.MATCHED, result.status(i), "peak " + i);
        }
        assertEquals(groups[2], result.matchedPosition(2), 1e-18);
    }

    @Test
    void aNarrowVelocitySearchFindsTheShiftFromResolvedGroupsAlone() {
        // only the multiplet's two groups, at rest, searched over +-5 km/s: the centroid's votes
        // alone put the shift at the main group's offset from the centroid (about -2 km/s)
        LineCatalog catalog = triplet();
        double sigma = 0.5e-12;
        double[] groups = catalog.positions(0, 5 * sigma);
        PeakList resolved = peaks(sigma, groups[1], groups[2]);
        ShiftSearch.Fit fit = ShiftSearch.redshift(Identifier.of(Tolerance.kSigma(5)), resolved, catalog, 5e3);
        assertEquals(0, fit.value(), 1e-12, "velocity " + fit.velocity());
        assertEquals(2, fit.matches());
        ShiftSearch.Fit offset = ShiftSearch.offset(Identifier.of(Tolerance.kSigma(5)), resolved, catalog, 0.01e-9);
        assertEquals(0, offset.value(), 1e-18);
    }

    @Test
    void theWindowOfABlendIsTheUnionAroundItsPositions() {
        // random invented blends: the window length equals the union of [x - h, x + h] over the
        // positions a peak may see the blend at, computed here by merging the intervals
        java.util.SplittableRandom random = new java.util.SplittableRandom(3);
        for (int trial = 0; trial < 500; trial++) {
            int n = 2 + random.nextInt(6);
            double[] at = new double[n];
            double[] weights = new double[n];
            for (int k = 0; k < n; k++) {
                at[k] = 500e-9 + random.nextDouble(0, 50e-12);
                weights[k] = random.nextDouble(0.01, 1);
            }
            double centroid = 0;
            double total = 0;
            for (int k = 0; k < n; k++) {
                centroid += weights[k] * at[k];
                total += weights[k];
            }
            LineCatalog catalog = LineCatalog.builder().addBlend(HE, centroid / total, 0, 1, "b", at, weights).build();
            double h = random.nextDouble(0.5e-12, 10e-12);
            double[] positions = catalog.positions(0, h);
            Arrays.sort(positions);
            // merge the intervals one by one
            double union = 0;
            double start = positions[0] - h;
            double end = positions[0] + h;
            for (int k = 1; k < positions.length; k++) {
                if (positions[k] - h > end) {
                    union += end - start;
                    start = positions[k] - h;
                }
                end = positions[k] + h;
            }
            union += end - start;
            assertEquals(union, catalog.windowLength(0, h), 1e-9 * union, "trial " + trial);
        }
    }
}
