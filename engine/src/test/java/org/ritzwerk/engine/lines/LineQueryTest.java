package org.ritzwerk.engine.lines;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.doubles;
import static org.quicktheories.generators.SourceDSL.integers;

import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.StrengthClass;
import org.ritzwerk.engine.convert.SpectralArrays;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Energy;
import org.ritzwerk.quantity.Frequency;
import org.ritzwerk.quantity.SpectralQuantity;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.quantity.Wavelength;
import org.ritzwerk.quantity.Wavenumber;

/**
 * The query on seeded random line sets (QuickTheories): a window in any unit and medium returns
 * exactly the lines inside it, air wavelengths go back to the vacuum ones, thresholds and species
 * filters keep exactly the lines that pass; and on one-electron ions and lists: the Balmer series,
 * a transition by its two levels, a tier, strength classes, and the refusals.
 */
class LineQueryTest {

    private static final long SEED = 1885L;
    private static final Species[] SPECIES = {Species.parse("Ne I"), Species.parse("Ar I"), Species.parse("Hg I")};
    private static final Unit[] UNITS = {Unit.NANOMETRE, Unit.NANOMETRE, Unit.PER_CENTIMETRE, Unit.TERAHERTZ,
        Unit.ELECTRONVOLT};
    private static final Medium[] MEDIA = {Medium.vacuum(), Medium.air(), null, null, null};

    /** 200 lines between 250 and 2000 nm (vacuum), random species, A on about half, intensity on some. */
    private static LineSet random(long seed) {
        Random random = new Random(seed);
        LineSet.Builder b = LineSet.builder();
        for (int i = 0; i < 200; i++) {
            b.addWavelength(SPECIES[random.nextInt(3)], LineSet.Source.of("random"), "line " + i,
                    (250 + 1750 * random.nextDouble()) * 1e-9);
            if (random.nextBoolean()) {
                b.einsteinA(Math.pow(10, 4 + 5 * random.nextDouble()));
            }
            if (random.nextInt(3) == 0) {
                b.relativeIntensity(1000 * random.nextDouble());
            }
        }
        return b.build();
    }

    private static SpectralQuantity end(double value, int kind) {
        switch (kind) {
            case 0:
            case 1:
                return Wavelength.of(value, Unit.NANOMETRE, MEDIA[kind]);
            case 2:
                return Wavenumber.of(value, Unit.PER_CENTIMETRE);
            case 3:
                return Frequency.of(value, Unit.TERAHERTZ);
            default:
                return Energy.of(value, Unit.ELECTRONVOLT);
        }
    }

    @Test
    void aWindowInAnyUnitAndMediumHoldsExactlyTheLinesInside() {
        qt().withFixedSeed(SEED).withExamples(60)
                .forAll(integers().between(0, 1_000_000), integers().between(0, 4), doubles().between(260, 1990),
                        doubles().between(260, 1990))
                .checkAssert((seed, kind, a, b) -> {
                    LineSet all = random(seed);
                    if (a.equals(b)) {
                        assertThrows(IllegalArgumentException.class, () -> LineQuery.defaults()
                                .withWindow(end(a, 0), end(b, 0)));
                        return;
                    }
                    // The window's ends, written in the unit (and medium) of this kind.
                    double[] ends = {a, b};
                    SpectralArrays.convert(ends, Unit.NANOMETRE, Medium.vacuum(), UNITS[kind], MEDIA[kind], ends);
                    LineSet found = LineQuery.defaults().withWindow(end(ends[0], kind), end(ends[1], kind))
                            .run(LineSources.none().withLineSet(all));
                    double low = Math.min(ends[0], ends[1]);
                    double high = Math.max(ends[0], ends[1]);
                    Set<Double> got = new HashSet<>();
                    for (int i = 0; i < found.size(); i++) {
                        got.add(found.vacuumWavelengthMetres(i));
                        if (i > 0) {
                            assertTrue(found.frequencyHz(i - 1) >= found.frequencyHz(i), "falling frequency");
                        }
                    }
                    double[] position = all.vacuumWavelengthsMetres();
                    SpectralArrays.convert(position, Unit.METRE, Medium.vacuum(), UNITS[kind], MEDIA[kind], position);
                    for (int i = 0; i < all.size(); i++) {
                        double p = position[i];
                        if (Math.abs(p - low) <= 1e-12 * low || Math.abs(p - high) <= 1e-12 * high) {
                            continue;   // on an end to rounding: either answer is right
                        }
                        assertEquals(p >= low && p <= high, got.contains(all.vacuumWavelengthMetres(i)),
                                () -> "seed " + seed + " kind " + kind + ": " + p + " in " + low + " .. " + high);
                    }
                });
    }

    @Test
    void airWavelengthsGoBackToTheVacuumOnes() {
        qt().withFixedSeed(SEED).withExamples(20).forAll(integers().between(0, 1_000_000)).checkAssert(seed -> {
            LineSet set = random(seed);
            for (int i = 0; i < set.size(); i++) {
                double vacuum = set.vacuumWavelengthMetres(i);
                double air = set.wavelengthMetres(i, Medium.air());
                assertTrue(air < vacuum, "air is denser than vacuum");
                assertEquals(vacuum, Medium.air().toVacuum(air), 4 * Math.ulp(vacuum), "seed " + seed);
                assertEquals(vacuum, set.wavelengthMetres(i, Medium.vacuum()), 0.0);
            }
        });
    }

    @Test
    void thresholdsAndSpeciesKeepExactlyTheLinesThatPass() {
        qt().withFixedSeed(SEED).withExamples(40)
                .forAll(integers().between(0, 1_000_000), doubles().between(3.5, 9.5), doubles().between(0, 1000),
                        integers().between(0, 2))
                .checkAssert((seed, logA, intensity, s) -> {
                    LineSet all = random(seed);
                    LineSources sources = LineSources.none().withLineSet(all);
                    double minA = Math.pow(10, logA);
                    LineSet byA = LineQuery.defaults().withMinEinsteinA(minA).run(sources);
                    LineSet byIntensity = LineQuery.defaults().withMinRelativeIntensity(intensity).run(sources);
                    LineSet bySpecies = LineQuery.defaults().withSpecies(List.of(SPECIES[s])).run(sources);
                    int a = 0;
                    int r = 0;
                    int n = 0;
                    for (int i = 0; i < all.size(); i++) {
                        a += all.einsteinA(i).isPresent() && all.einsteinA(i).getAsDouble() >= minA ? 1 : 0;
                        // A threshold of 0 keeps every line, known intensity or not.
                        r += intensity == 0 || all.relativeIntensity(i).isPresent()
                                && all.relativeIntensity(i).getAsDouble() >= intensity ? 1 : 0;
                        n += all.species(i).equals(SPECIES[s]) ? 1 : 0;
                    }
                    assertEquals(a, byA.size());
                    assertEquals(r, byIntensity.size());
                    assertEquals(n, bySpecies.size());
                    for (int i = 0; i < byA.size(); i++) {
                        assertTrue(byA.einsteinA(i).getAsDouble() >= minA);
                    }
                    for (int i = 0; i < bySpecies.size(); i++) {
                        assertEquals(SPECIES[s], bySpecies.species(i));
                    }
                    // A threshold of 0 keeps every line, known A or not.
                    assertEquals(all.size(), LineQuery.defaults().withMinEinsteinA(0).run(sources).size());
                });
    }

    @Test
    void theBalmerSeriesInAir() {
        LineSet balmer = LineQuery.defaults()
                .withWindow(Wavelength.ofNanometres(360, Medium.air()), Wavelength.ofNanometres(700, Medium.air()))
                .withMaxN(10).withMultiplets(true).withLowerN(2)
                .run(LineSources.none().withHydrogenLike(Sources.H, Sources.hydrogen(Tier.QED)));
        // n = 3 .. 10 down to 2, all above the Balmer limit 364.6 nm (common practice).
        assertEquals(8, balmer.size());
        for (int i = 0; i < balmer.size(); i++) {
            assertEquals(2, balmer.lowerN(i).getAsInt());
            assertEquals(10 - i, balmer.upperN(i).getAsInt(), "by falling frequency: alpha last");
        }
        int alpha = balmer.size() - 1;
        assertEquals("Balmer alpha", balmer.name(alpha));
        // H-alpha 656.28 nm in standard air (NIST ASD H I lines, from memory; checked with the
        // Rydberg formula, 36 / (5 R_H) = 656.47 nm in vacuum, less 0.18 nm for air): 0.01 nm.
        assertEquals(656.28, balmer.wavelengthMetres(alpha, Medium.air()) * 1e9, 0.01);
        // H-alpha multiplet A = 4.4101e7 s^-1 (Wiese & Fuhr 2009, as in PublishedHydrogenTest): 0.1 %.
        assertEquals(4.4101e7, balmer.einsteinA(alpha).getAsDouble(), 4.4101e4);
        // The series filter on components too: every Lyman line is left out.
        LineSet lyman = LineQuery.defaults().withWindowHz(1e14, 4e15).withMaxN(5).withLowerN(1)
                .run(LineSources.none().withHydrogenLike(Sources.H, Sources.hydrogen(Tier.QED)));
        assertFalse(lyman.isEmpty());
        for (int i = 0; i < lyman.size(); i++) {
            assertEquals(1, lyman.lowerN(i).getAsInt());
        }
    }

    @Test
    void aTransitionByItsTwoLevelsInEitherOrder() {
        LineSources hydrogen = LineSources.none().withHydrogenLike(Sources.H, Sources.hydrogen(Tier.QED));
        State s = State.parse("1s1/2");
        State p = State.parse("2p3/2");
        LineSet one = LineQuery.defaults().withTransition(s, p).run(hydrogen);
        LineSet other = LineQuery.defaults().withTransition(p, s).run(hydrogen);
        assertEquals(1, one.size());
        assertEquals(Optional.of(p), one.upperState(0));
        assertEquals(Optional.of(s), one.lowerState(0));
        assertEquals(one.frequencyHz(0), other.frequencyHz(0), 0.0);
        // Lyman-alpha 121.567 nm in vacuum (NIST ASD H I lines, from memory; checked with the Rydberg
        // formula, 4 / (3 R_H) = 121.568 nm): 0.001 nm.
        assertEquals(121.567, one.vacuumWavelengthNm(0), 0.001);
        // Lyman-alpha components' A = 6.2648e8 s^-1 (Wiese & Fuhr 2009, as in PublishedHydrogenTest): 0.1 %.
        assertEquals(6.2648e8, one.einsteinA(0).getAsDouble(), 6.2648e5);
        // A window that leaves it out leaves it out.
        assertTrue(LineQuery.defaults().withTransition(s, p).withWindowHz(1e14, 2e14).run(hydrogen).isEmpty());
        // Not an electric-dipole pair: the generator's message.
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> LineQuery.defaults().withTransition(s, State.parse("2s1/2")).run(hydrogen));
        assertTrue(e.getMessage().contains("not joined by an electric-dipole line"), e.getMessage());
        // In a list, the lines whose labels read as the two states.
        LineSources lithium = LineSources.none().withLineList(Sources.wavenumberList());
        LineSet li = LineQuery.defaults().withTransition(State.parse("2p3/2"), State.parse("2s1/2")).run(lithium);
        assertEquals(1, li.size());
        assertEquals(14904.0, li.wavenumberPerCm(0), 1e-9);
        // The Rb D2 line of the test atom, by its levels.
        LineSet d2 = LineQuery.defaults().withTransition(State.parse("5s1/2"), State.parse("5p3/2"))
                .run(LineSources.none().withAlkali(Sources.rubidium()));
        assertEquals(1, d2.size());
        assertEquals("p-s", d2.name(0));
    }

    @Test
    void aTierReplacesTheModelsOwn() {
        LineSources hydrogen = LineSources.none().withHydrogenLike(Sources.H, Sources.hydrogen(Tier.QED));
        LineQuery lyman = LineQuery.defaults().withWindowHz(2.4e15, 2.5e15).withMaxN(2);
        LineSet qed = lyman.run(hydrogen);
        LineSet bohr = lyman.withTier(Tier.BOHR).run(hydrogen);
        assertEquals(2, qed.size());
        assertEquals(2, bohr.size());
        // Fine structure splits 2p1/2 and 2p3/2 in QED; the Bohr tier does not (common practice).
        assertTrue(qed.frequencyHz(0) > qed.frequencyHz(1));
        assertEquals(bohr.frequencyHz(0), bohr.frequencyHz(1), 0.0);
        assertEquals("bohr", bohr.source(0).model());
        assertEquals("qed", qed.source(0).model());
    }

    @Test
    void listsStrengthClassesLimitsAndSpeciesSets() {
        LineSources both = LineSources.none().withLineList(Sources.neonInAir()).withLineList(Sources.wavenumberList());
        LineSet all = LineQuery.defaults().run(both);
        assertEquals(5, all.size());
        // Strength classes: strong and medium kept, weak and unclassified lines left out.
        LineSet medium = LineQuery.defaults().withMinStrengthClass(StrengthClass.MEDIUM).run(both);
        assertEquals(2, medium.size());
        assertEquals(3, LineQuery.defaults().withMinStrengthClass(StrengthClass.WEAK).run(both).size());
        // A limit on n keeps list lines with no n; a series filter does not.
        assertEquals(4, LineQuery.defaults().withMaxN(1).run(both).size(), "only the Li 2p3/2 line has n > 1");
        assertEquals(1, LineQuery.defaults().withLowerN(2).run(both).size());
        assertEquals(2, LineQuery.defaults().withSpecies(List.of(Species.parse("Li I"))).run(both).size());
        assertEquals(0, LineQuery.defaults().withSpecies(List.of(Species.parse("Ne I")))
                .withMinOscillatorStrength(0.1).run(both).size());
    }

    @Test
    void anElementLevelSpeciesKeepsTheLinesOfItsIsotopes() {
        // The test rubidium is Rb-87 I; "Rb I" names the element, as a data context resolves it.
        LineSources sources = LineSources.none().withAlkali(Sources.rubidium()).withHydrogenLike(Sources.H,
                Sources.hydrogen(Tier.QED));
        assertEquals(Species.parse("Rb-87 I"), Sources.rubidium().species());
        LineQuery window = LineQuery.defaults().withWindow(Wavelength.ofNanometres(775, Medium.vacuum()),
                Wavelength.ofNanometres(800, Medium.vacuum())).withMaxN(5).withMaxL(1);
        LineSet byElement = window.withSpecies(List.of(Species.parse("Rb I"))).run(sources);
        LineSet byIsotope = window.withSpecies(List.of(Species.parse("Rb-87 I"))).run(sources);
        // The D lines, 780.24 and 794.98 nm vacuum (NIST ASD Rb I, from memory): 0.01 nm.
        assertEquals(2, byElement.size());
        assertEquals(780.24, byElement.vacuumWavelengthNm(0), 0.01);
        assertEquals(794.98, byElement.vacuumWavelengthNm(1), 0.01);
        assertEquals(byIsotope, byElement);
        assertEquals(window.run(sources), byElement, "H I has no line in 775-800 nm at n <= 5 (common practice)");
    }

    @Test
    void aSpeciesNoSourceOffersOrAnEmptySpeciesListIsRefused() {
        LineSources sources = LineSources.none().withAlkali(Sources.rubidium()).withLineList(Sources.neonInAir());
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> LineQuery.defaults()
                .withSpecies(List.of(Species.parse("Rb-85 I"), Species.parse("Ne I"), Species.parse("Ar I")))
                .withWindow(Wavelength.ofNanometres(500, Medium.vacuum()),
                        Wavelength.ofNanometres(900, Medium.vacuum()))
                .run(sources));
        assertEquals("withSpecies: Rb-85 I, Ar I are offered by none of the sources, which offer [Rb-87 I, Ne I];"
                + " add a source for it or leave it out of withSpecies", e.getMessage());
        // An isotope does not stand for another isotope, nor D for hydrogen of unstated mass.
        assertThrows(IllegalArgumentException.class, () -> LineQuery.defaults().withSpecies(List.of(
                Species.parse("D I"))).run(LineSources.none().withLineSet(LineSet.empty())));
        IllegalArgumentException empty = assertThrows(IllegalArgumentException.class,
                () -> LineQuery.defaults().withSpecies(List.of()));
        assertTrue(empty.getMessage().startsWith("withSpecies needs at least one species"), empty.getMessage());
        LineQuery neon = LineQuery.defaults().withSpecies(List.of(Species.parse("Ne I")));
        LineSources lists = LineSources.none().withLineList(Sources.neonInAir()).withLineList(Sources.wavenumberList());
        assertEquals(3, neon.run(lists).size(), "the three neon lines of the test list");
        assertEquals(5, neon.withAllSpecies().run(lists).size(), "and the two of the wavenumber list");
    }

    @Test
    void computedSourcesNeedAWindowOrATransition() {
        IllegalStateException e = assertThrows(IllegalStateException.class, () -> LineQuery.defaults()
                .run(LineSources.none().withHydrogenLike(Sources.H, Sources.hydrogen(Tier.QED))));
        assertEquals("computed lines (one-electron ions, alkali atoms) need a window or a transition: give withWindow"
                + " or withTransition", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> LineQuery.defaults()
                .withWindow(Wavelength.ofNanometres(500, Medium.vacuum()), Frequency.ofHertz(PhysicalConstants.C / 500e-9)));
        assertThrows(IllegalArgumentException.class, () -> LineQuery.defaults().withMaxN(0));
        assertThrows(IllegalArgumentException.class, () -> LineQuery.defaults().withMinEinsteinA(Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> LineQuery.defaults().withLowerN(0));
        assertThrows(IllegalArgumentException.class,
                () -> LineSources.none().withHydrogenLike(Species.parse("He II"), Sources.hydrogen(Tier.QED)));
    }

    @Test
    void theBuilderRefusesUnusableValuesAndLeavesUnknownsAbsent() {
        LineSet.Builder b = LineSet.builder();
        assertThrows(IllegalStateException.class, () -> b.einsteinA(1));
        IllegalArgumentException nan = assertThrows(IllegalArgumentException.class,
                () -> b.addWavelength(Sources.H, LineSet.Source.of("x"), "x", Double.NaN));
        assertEquals("line 0: vacuum wavelength (m) must be finite and positive, got NaN", nan.getMessage());
        b.addFrequency(Sources.H, LineSet.Source.of("mine"), "mine", 1e15);
        assertThrows(IllegalArgumentException.class, () -> b.einsteinA(-1));
        assertThrows(IllegalArgumentException.class, () -> b.upperShell(0));
        assertThrows(IllegalArgumentException.class, () -> b.lowerShell(-1));
        assertThrows(IllegalArgumentException.class,
                () -> b.add(Sources.H, LineSet.Source.of("x"), "x", 500e-9, 1e15));
        LineSet set = b.build();
        assertEquals(1, set.size());
        assertEquals(PhysicalConstants.C / 1e15, set.vacuumWavelengthMetres(0), 0.0);
        assertTrue(set.einsteinA(0).isEmpty());
        assertTrue(set.upperN(0).isEmpty());
        assertTrue(set.upperState(0).isEmpty());
        assertTrue(set.upperLabel(0).isEmpty());
        assertTrue(set.upperWeight(0).isEmpty());
        assertTrue(set.strengthClass(0).isEmpty());
        assertTrue(set.vacuumWavelengthUncertaintyMetres(0).isEmpty());
        assertFalse(set.isMultiplet(0));
        assertTrue(set.components(0).isEmpty());
        assertEquals(Optional.empty(), set.source(0).dataSet());
    }

    @Test
    void equalityIsExactAndCopiesKeepIt() {
        LineSet neon = LineSet.of(Sources.neonInAir());
        assertEquals(neon, LineSet.of(Sources.neonInAir()));
        assertEquals(neon.hashCode(), LineSet.of(Sources.neonInAir()).hashCode());
        assertEquals(neon, neon.select(new int[] {0, 1, 2}));
        assertEquals(neon, LineSet.concat(List.of(LineSet.empty(), neon)));
        assertFalse(neon.equals(neon.select(new int[] {1, 0, 2})));
        assertFalse(neon.equals(neon.filter(i -> i > 0)));
        LineSet alpha = LineQuery.defaults().withWindowHz(4.5e14, 4.6e14).withMaxN(3).withMultiplets(true)
                .withMultipletComponents(true)
                .run(LineSources.none().withHydrogenLike(Sources.H, Sources.hydrogen(Tier.QED)));
        assertEquals(alpha, alpha.select(new int[] {0}));
        assertFalse(alpha.equals(LineQuery.defaults().withWindowHz(4.5e14, 4.6e14).withMaxN(3).withMultiplets(true)
                .run(LineSources.none().withHydrogenLike(Sources.H, Sources.hydrogen(Tier.QED)))),
                "components are part of the set");
        assertEquals("LineQuery[species all, 4.5E14 to 4.6E14 Hz, n <= 3, multiplets]",
                LineQuery.defaults().withWindowHz(4.5e14, 4.6e14).withMaxN(3).withMultiplets(true).toString());
    }
}
