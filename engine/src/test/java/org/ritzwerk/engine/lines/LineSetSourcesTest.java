package org.ritzwerk.engine.lines;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.StrengthClass;
import org.ritzwerk.engine.convert.SpectralArrays;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.LineTable;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.AlkaliLines;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.testing.Golden;

/**
 * A line set built from each source gives the source's own wavelengths, rates and labels: the
 * one-electron line generator (every tier; and the golden exact rates), the alkali lines, and
 * line lists in air wavelengths and in wavenumbers.
 */
class LineSetSourcesTest {

    private static final double ATOMIC_DIPOLE = PhysicalConstants.E * PhysicalConstants.FINE_STRUCTURE.value()
            / (4 * Math.PI * PhysicalConstants.RYDBERG.value());

    /** A source given twice would double every line (a Balmer query gave 6 multiplets for 3); refused. */
    @Test
    void aSourceGivenTwiceIsRefused() {
        HydrogenLikeModel model = HydrogenLikeModel.of(Sources.HELIUM4, Tier.DIRAC);
        org.ritzwerk.atom.Species heII = org.ritzwerk.atom.Species.parse("He II");
        LineSources once = LineSources.none().withHydrogenLike(heII, model);
        IllegalArgumentException twice = org.junit.jupiter.api.Assertions.assertThrows(
                IllegalArgumentException.class, () -> once.withHydrogenLike(heII, model));
        assertTrue(twice.getMessage().startsWith("He II is a source already"), twice.getMessage());
        LineSet set = LineQuery.defaults().withWindowHz(4e14, 8e14).run(once);
        LineSources withSet = once.withLineSet(set);
        org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class, () -> withSet.withLineSet(set));
        assertEquals(2, withSet.size(), "a model and a line set of one species are two sources");
    }

    @Test
    void everyTierOfAOneElectronIonGivesTheGeneratorsColumns() {
        for (Tier tier : Tier.values()) {
            for (boolean blend : new boolean[] {false, true}) {
                HydrogenLikeModel model = HydrogenLikeModel.of(Sources.HELIUM4, tier);
                HydrogenLikeLines generator = HydrogenLikeLines.of(model);
                LineTable table = blend ? generator.multiplets(8, 1e14, 3e15) : generator.components(8, 1e14, 3e15);
                LineSet set = LineQuery.defaults().withWindowHz(1e14, 3e15).withMaxN(8).withMultiplets(blend)
                        .run(LineSources.none().withHydrogenLike(Sources.HE_II, model));
                assertEquals(table.size(), set.size(), tier + " " + blend);
                double ground = model.energy(1, 0, 1);
                // The table rises in frequency, the set falls; equal frequencies (degenerate in the
                // Bohr tier) keep the table's order.
                List<Integer> order = new java.util.ArrayList<>();
                for (int k = 0; k < table.size(); k++) {
                    order.add(k);
                }
                order.sort((a, b) -> Double.compare(table.frequency(b), table.frequency(a)));
                for (int i = 0; i < table.size(); i++) {
                    int k = order.get(i);
                    String where = tier + " line " + k + " " + table.lineName(k);
                    // Source: the line generator itself (HydrogenLikeLines), column by column.
                    assertEquals(table.frequency(k), set.frequencyHz(i), 0.0, where);
                    assertEquals(PhysicalConstants.C / table.frequency(k), set.vacuumWavelengthMetres(i), 0.0, where);
                    assertEquals(table.einsteinA(k), set.einsteinA(i).getAsDouble(), 0.0, where);
                    assertEquals(table.oscillatorStrength(k), set.oscillatorStrength(i).getAsDouble(), 0.0, where);
                    assertEquals(table.lineStrength(k) / (ATOMIC_DIPOLE * ATOMIC_DIPOLE),
                            set.lineStrengthAtomicUnits(i).getAsDouble(), 0.0, where);
                    assertEquals(table.upperWeight(k), set.upperWeight(i).getAsInt(), where);
                    assertEquals(table.lowerWeight(k), set.lowerWeight(i).getAsInt(), where);
                    assertEquals(table.lineName(k), set.name(i), where);
                    assertEquals(Optional.of(table.upperLabel(k)), set.upperLabel(i), where);
                    assertEquals(table.upperN(k), set.upperN(i).getAsInt(), where);
                    assertEquals(table.lowerN(k), set.lowerN(i).getAsInt(), where);
                    assertEquals(blend, set.isMultiplet(i), where);
                    assertEquals(blend, set.upperL(i).isEmpty(), where);
                    double upper = blend ? model.energy(table.upperN(k), 0, 1)
                            : model.energy(table.upperN(k), table.upperL(k), table.upperTwoJ(k));
                    assertEquals(upper - ground, set.upperEnergyJoules(i).getAsDouble(), 0.0, where);
                    assertEquals(tier.id(), set.source(i).model(), where);
                    assertEquals(Sources.HE_II, set.species(i));
                }
            }
        }
    }

    @Test
    void componentSumsMatchTheGoldenExactRates() {
        // Golden: hydrogen-rates.csv, exact radial integrals (sympy 1.11.1, mpmath 1.2.1; infinite
        // nuclear mass, Bohr tier); tolerance from the file's header. The components of n l -> n' l'
        // come from one query, summed with their weights as GoldenHydrogenTest sums the generator's.
        HydrogenLikeModel model = HydrogenLikeModel.of(Sources.infinitelyHeavy(1), Tier.BOHR);
        LineSet all = LineQuery.defaults().withWindowHz(1e12, 4e15).withMaxN(6)
                .run(LineSources.none().withHydrogenLike(Sources.H, model));
        double tolerance = Golden.tolerance("hydrogen-rates.csv");
        int rows = 0;
        for (Map<String, String> row : Golden.rows("hydrogen-rates.csv")) {
            int nU = Integer.parseInt(row.get("n_upper"));
            int lU = Integer.parseInt(row.get("l_upper"));
            int nL = Integer.parseInt(row.get("n_lower"));
            int lL = Integer.parseInt(row.get("l_lower"));
            double gA = 0;
            double gF = 0;
            for (int i = 0; i < all.size(); i++) {
                if (all.upperN(i).getAsInt() == nU && all.upperL(i).getAsInt() == lU && all.lowerN(i).getAsInt() == nL
                        && all.lowerL(i).getAsInt() == lL) {
                    gA += all.upperWeight(i).getAsInt() * all.einsteinA(i).getAsDouble();
                    gF += all.lowerWeight(i).getAsInt() * all.oscillatorStrength(i).getAsDouble();
                }
            }
            double a = gA / (2 * (2 * lU + 1));
            double f = gF / (2 * (2 * lL + 1));
            assertTrue(Golden.relativeError(Double.parseDouble(row.get("einstein_a_per_s")), a) <= tolerance,
                    () -> "golden hydrogen-rates.csv " + row + ": A " + a);
            assertTrue(Golden.relativeError(Double.parseDouble(row.get("f_absorption")), f) <= tolerance,
                    () -> "golden hydrogen-rates.csv " + row + ": f " + f);
            rows++;
        }
        assertEquals(55, rows);
    }

    @Test
    void aMultipletCarriesItsComponents() {
        HydrogenLikeModel model = Sources.hydrogen(Tier.QED);
        LineSet alpha = LineQuery.defaults().withWindowHz(4.5e14, 4.6e14).withMaxN(3).withMultiplets(true)
                .withMultipletComponents(true).run(LineSources.none().withHydrogenLike(Sources.H, model));
        assertEquals(1, alpha.size());
        assertTrue(alpha.isMultiplet(0));
        assertEquals("Balmer alpha", alpha.name(0));
        LineSet parts = alpha.components(0);
        // The seven E1 components of 3 -> 2 (3s-2p1/2, 3s-2p3/2, 3p1/2-2s, 3p3/2-2s, 3d3/2-2p1/2,
        // 3d3/2-2p3/2, 3d5/2-2p3/2): selection rules, common practice.
        assertEquals(7, parts.size());
        // Source: HydrogenLikeLines.multiplets, which defines the multiplet as the components'
        // strength-weighted frequency and weight-averaged A: the same sums over the attached parts.
        double s = 0;
        double sNu = 0;
        double gA = 0;
        for (int k = 0; k < parts.size(); k++) {
            s += parts.lineStrengthAtomicUnits(k).getAsDouble();
            sNu += parts.lineStrengthAtomicUnits(k).getAsDouble() * parts.frequencyHz(k);
            gA += parts.upperWeight(k).getAsInt() * parts.einsteinA(k).getAsDouble();
            assertEquals(3, parts.upperN(k).getAsInt());
            assertEquals(2, parts.lowerN(k).getAsInt());
            assertFalse(parts.isMultiplet(k));
        }
        assertEquals(alpha.frequencyHz(0), sNu / s, 1e-12 * alpha.frequencyHz(0));
        assertEquals(alpha.einsteinA(0).getAsDouble(), gA / 18, 1e-12 * gA);
        assertEquals(18, alpha.upperWeight(0).getAsInt());
        // Without asking, a multiplet's components are not computed.
        LineSet bare = LineQuery.defaults().withWindowHz(4.5e14, 4.6e14).withMaxN(3).withMultiplets(true)
                .run(LineSources.none().withHydrogenLike(Sources.H, model));
        assertTrue(bare.isMultiplet(0));
        assertTrue(bare.components(0).isEmpty());
        // A component set survives filtering and concatenation.
        LineSet twice = LineSet.concat(List.of(alpha, alpha));
        assertEquals(7, twice.components(1).size());
        assertEquals(parts.frequencyHz(3), twice.components(1).frequencyHz(3), 0.0);
    }

    @Test
    void alkaliLinesKeepTheirColumns() {
        AlkaliAtom rb = Sources.rubidium();
        double low = PhysicalConstants.C / 2000e-9;
        double high = PhysicalConstants.C / 300e-9;
        List<AlkaliLines.Line> lines = AlkaliLines.window(rb, low, high, 12, 3, 0, f -> { });
        LineSet set = LineQuery.defaults().withWindowHz(low, high).withMaxN(12)
                .run(LineSources.none().withAlkali(rb));
        assertEquals(lines.size(), set.size());
        for (int i = 0; i < lines.size(); i++) {
            AlkaliLines.Line line = lines.get(i);
            // Source: AlkaliLines.window itself, column by column (both highest frequency first).
            assertEquals(line.frequency(), set.frequencyHz(i), 0.0, line.label());
            assertEquals(line.vacuumWavelengthMetres(), set.vacuumWavelengthMetres(i), 0.0, line.label());
            assertEquals(line.einsteinA(), set.einsteinA(i).getAsDouble(), 0.0, line.label());
            assertEquals(line.oscillatorStrength(), set.oscillatorStrength(i).getAsDouble(), 0.0, line.label());
            assertEquals(line.lineStrength(), set.lineStrengthAtomicUnits(i).getAsDouble(), 0.0, line.label());
            assertEquals(Optional.of(line.upper()), set.upperState(i));
            assertEquals(Optional.of(line.lower()), set.lowerState(i));
            assertEquals(line.label(), set.upperLabel(i).get() + " - " + set.lowerLabel(i).get());
            assertEquals(line.upper().twoJ() + 1, set.upperWeight(i).getAsInt());
            assertEquals(rb.energyJoules(line.upper()), set.upperEnergyJoules(i).getAsDouble(), 0.0);
            assertEquals("quantum-defect", set.source(i).model());
            assertEquals("test-rb", set.source(i).dataSet().get().id());
        }
        int d2 = indexOf(set, State.parse("5p3/2"), State.parse("5s1/2"));
        assertEquals("p-s", set.name(d2));
        // Rb D2 at 780.241 nm in vacuum (NIST ASD Rb I lines, from memory; the measured 5p3/2 level
        // of the test atom, 12816.545 cm-1, gives it independently): 0.001 nm.
        assertEquals(780.241, set.vacuumWavelengthNm(d2), 0.001);
    }

    @Test
    void lineListsInAirAndInWavenumbersConvertOnce() {
        LineList neon = Sources.neonInAir();
        LineSet set = LineSet.of(neon);
        double[] vacuum = SpectralArrays.wavelengths(neon, Unit.METRE, Medium.vacuum());
        for (int i = 0; i < neon.size(); i++) {
            // Source: the list's own positions, through SpectralArrays (standard air, Medium.air()).
            assertEquals(vacuum[i], set.vacuumWavelengthMetres(i), 0.0);
            assertEquals(neon.position(i) * 1e-9, set.wavelengthMetres(i, Medium.air()), 2e-15 * vacuum[i]);
            assertEquals(PhysicalConstants.C / vacuum[i], set.frequencyHz(i), 1e-15 * set.frequencyHz(i));
            assertEquals(neon.einsteinA(i), set.einsteinA(i));
            assertEquals(neon.intensity(i), set.relativeIntensity(i));
            assertEquals(Optional.ofNullable(neon.strength(i)), set.strengthClass(i));
            assertEquals(Math.abs(vacuum[i] / neon.position(i)) * neon.uncertainty(i).getAsDouble(),
                    set.vacuumWavelengthUncertaintyMetres(i).getAsDouble(), 0.0);
            assertEquals(vacuum[i], set.vacuumWavelength(i).inMetres(), 0.0);
            assertEquals(set.vacuumWavelengthUncertaintyMetres(i).getAsDouble(),
                    set.vacuumWavelength(i).uncertaintyIn(Unit.METRE).getAsDouble(), 1e-30);
            assertEquals(set.frequencyHz(i), set.frequency(i).inHertz(), 0.0);
            assertEquals("line-list", set.source(i).model());
            assertEquals(neon.info(), set.source(i).dataSet().get());
        }
        assertEquals("640.2248 nm air", set.name(1));
        assertEquals(Optional.of("2p9"), set.upperLabel(1));
        assertTrue(set.upperN(1).isEmpty(), "a label that is no state gives no quantum numbers");
        // 585.2488 nm in standard air is 585.4110 nm in vacuum: Morton 2000's formula (D. C. Morton,
        // ApJS 130, 403 (2000), eq. 8) iterated separately in Python gives 585.41104 nm; 1e-4 nm.
        assertEquals(585.4110, set.vacuumWavelengthNm(0), 1e-4);

        LineList li = Sources.wavenumberList();
        LineSet lithium = LineSet.of(li);
        // 14904.0 cm-1 is 1e7 / 14904.0 = 670.96082 nm in vacuum and 14904.0 x 100 c Hz (by hand).
        assertEquals(1e7 / 14904.0, lithium.vacuumWavelengthNm(0), 1e-9);
        assertEquals(14904.0 * 100 * PhysicalConstants.C, lithium.frequencyHz(0), 1e-6);
        assertEquals(14904.0, lithium.wavenumberPerCm(0), 1e-9);
        assertEquals(Optional.of(State.parse("2p3/2")), lithium.upperState(0));
        assertEquals(Optional.of(StrengthClass.WEAK), lithium.strengthClass(0));
        assertTrue(lithium.upperState(1).isEmpty());
        // sigma_lambda = |lambda / position| sigma_position (first order): 0.01 cm-1 at 12300 cm-1
        // is 1e7 / 12300^2 x 0.01 nm = 6.6098e-4 nm (by hand).
        assertEquals(1e7 / 12300.0 / 12300.0 * 0.01, lithium.vacuumWavelengthUncertaintyMetres(1).getAsDouble() * 1e9,
                1e-9);
    }

    static int indexOf(LineSet set, State upper, State lower) {
        for (int i = 0; i < set.size(); i++) {
            if (set.upperState(i).equals(Optional.of(upper)) && set.lowerState(i).equals(Optional.of(lower))) {
                return i;
            }
        }
        throw new AssertionError("no line " + upper + " - " + lower + " in " + set);
    }
}
