package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.InputStream;
import java.util.List;
import java.util.Optional;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.data.ModelPotential;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.data.QuantumDefects;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.LevelOrigin;
import org.ritzwerk.engine.rydberg.RydbergException;
import org.ritzwerk.refdata.internal.RydbergData;
import org.ritzwerk.refdata.internal.RydbergProvider;

/** The built-in Rydberg data: what the provider offers, how the files read, and how broken files are refused. */
class RydbergDataTest {

    private static final List<String> ATOMS = List.of("li-7", "na-23", "k-39", "rb-85", "rb-87", "cs-133");

    /**
     * Li np (n = 3-10): the recalled ASD levels give one energy for both J, so the data split each
     * doublet by the 2p splitting scaled as n*^-3. Checked against the published p1/2 and p3/2
     * quantum defects of P. Goy et al., Phys. Rev. A 34, 2889 (1986) (from memory, the set the
     * engine uses from n = 11): the Rydberg-Ritz formulas' splitting at the same n agrees within
     * 2 % (1.5 % found), where it was 0 before; the (2J + 1)-weighted centroid stays the ASD value.
     */
    @Test
    void lithiumPDoubletsAreSplitAsThePublishedDefectsSplitThem() {
        DataContext context = DataContext.builtIn();
        AlkaliAtom li = context.alkaliAtom(Species.parse("Li-7 I"));
        QuantumDefects defects = li.quantumDefects();
        double limit = defects.limitPerCm();
        double rydberg = li.rydbergPerCm();
        double[] ritzSplit = new double[11];
        for (int n = 3; n <= 10; n++) {
            double e1 = li.energyPerCm(State.of(n, 1, 1));
            double e3 = li.energyPerCm(State.of(n, 1, 3));
            double published = ritz(defects, 1, 3, n, limit, rydberg) - ritz(defects, 1, 1, n, limit, rydberg);
            ritzSplit[n] = published;
            assertEquals(published, e3 - e1, 0.02 * published, "Li-7 " + n + "p");
            assertEquals(li.level(State.of(n, 1, 1)).origin(), LevelOrigin.MEASURED, n + "p1/2");
        }
        assertEquals(30925.38, (2 * li.energyPerCm(State.of(3, 1, 1)) + 4 * li.energyPerCm(State.of(3, 1, 3))) / 6,
                5e-4, "the 3p centroid is the ASD value");
        assertTrue(ritzSplit[3] > 0.09 && ritzSplit[3] < 0.11, "3p splitting " + ritzSplit[3]);
    }

    private static double ritz(QuantumDefects defects, int l, int twoJ, int n, double limit, double rydberg) {
        QuantumDefects.Series s = defects.series().stream().filter(x -> x.l() == l && x.twoJ() == twoJ)
                .findFirst().orElseThrow();
        double d0 = s.coefficients().get(0);
        double delta = 0;
        double x = 1;
        for (double c : s.coefficients()) {
            delta += c * x;
            x /= (n - d0) * (n - d0);
        }
        return limit - rydberg / ((n - delta) * (n - delta));
    }

    @Test
    void everyIsotopeHasAQuantumDefectSetAndItsMeasuredLevels() {
        DataRegistry registry = DataRegistry.builtIn();
        for (String atom : ATOMS) {
            QuantumDefects set = (QuantumDefects) registry.load("quantum-defects-" + atom);
            LevelList levels = (LevelList) registry.load("levels-" + atom);
            assertEquals(7, set.series().size(), atom);
            for (int l = 0; l <= 3; l++) {
                int ll = l;
                assertEquals(l == 0 ? 1 : 2, set.series().stream().filter(s -> s.l() == ll).count(), atom + " l=" + l);
            }
            // the digits were typed in from memory with their papers as citations, each row checked (column checked)
            assertEquals(Provenance.Kind.FROM_MEMORY, set.info().provenance().kind());
            assertFalse(set.info().provenance().detail().isBlank());
            assertEquals(0.0, levels.energy(0), 0.0, atom + ": the first level is the ground state");
            assertTrue(levels.size() >= 7, atom);
        }
        assertEquals(List.of("quantum-defects-rb-85", "quantum-defects-rb-87"),
                registry.find(DataKind.QUANTUM_DEFECTS, Species.parse("Rb I")).stream().map(l -> l.info().id())
                        .collect(Collectors.toList()));
        assertEquals("ritzwerk-rydberg", registry.find("levels-cs-133").orElseThrow().providerId());
        assertThrows(ReferenceDataException.class, () -> new RydbergProvider().load("quantum-defects-fr-223"));
    }

    @Test
    void rydbergConstantComesFromTheAtomicMass() {
        // R_M = R_inf / (1 + m_e / (M - m_e)) with CODATA 2018 R_inf = 109737.31568160 cm-1 and
        // m_e = 5.48579909065e-4 u and the AME2020 mass of Rb-87, 86.909180529 u: 109736.6230081 cm-1,
        // worked out for this test in 30-digit decimal arithmetic (Python's decimal module); to 2e-10 relative.
        assertEquals(109736.6230081, RydbergData.builtIn().quantumDefects(Species.parse("Rb-87 I")).defects()
                .rydbergPerCm(), 2e-5);
        // Cs-133: R_Cs = 109736.8627339 cm-1 as given by Deiglmayr et al., Phys. Rev. A 93, 013424 (2016)
        // (from memory); the same formula with CODATA 2018 and AME2020 gives 109736.8627304: to 1e-9 relative
        assertEquals(109736.8627339, QuantumDefectFiles.rydbergPerCm(Species.parse("Cs-133 I")), 1e-4);
    }

    @Test
    void theModelPotentialsReadFromTheirOwnFormat() {
        // model-potentials.csv (format ritzwerk-model-potentials 1): Marinescu et al. 1994, Table I, one row
        // per element and l = 0..3; Z from the element, alpha_c from its column, the source with its provenance
        for (String element : new String[] {"Li", "Na", "K", "Rb", "Cs"}) {
            ModelPotential potential = RydbergData.builtIn().modelPotential(Species.parse(element + " I"));
            assertEquals(4, potential.sets().size(), element);
            assertTrue(potential.source().startsWith("M. Marinescu, H. R. Sadeghpour and A. Dalgarno"), potential.source());
            assertTrue(potential.source().endsWith("(from-memory)"), potential.source());
        }
        ModelPotential rb = RydbergData.builtIn().modelPotential(Species.parse("Rb-87 I"));
        assertEquals(37, rb.z());
        assertEquals(9.076, rb.alphaC(), 0.0);
        assertEquals(new ModelPotential.Parameters(3.69628474, 1.64915255, -9.86069196, 0.19579987, 1.66242117),
                rb.sets().get(0));
        assertThrows(ReferenceDataException.class, () -> RydbergData.builtIn().modelPotential(Species.parse("Rb II")));
    }

    @Test
    void withoutAMassNumberTheMostAbundantIsotopeIsMeant() {
        AlkaliAtom rb = RydbergData.builtIn().atom(Species.parse("Rb I"));
        assertEquals(new Species(37, 85, 0), rb.species());
        assertEquals(List.of("Li-6 I", "Li-7 I", "Na-23 I", "K-39 I", "K-40 I", "K-41 I", "Rb-85 I", "Rb-87 I",
                "Cs-133 I"),
                RydbergData.builtIn().species().stream().map(Species::notation).collect(Collectors.toList()));
        ReferenceDataException missing = assertThrows(ReferenceDataException.class,
                () -> RydbergData.builtIn().atom(Species.parse("Fe I")));
        assertEquals(ReferenceDataException.UNKNOWN_DATA_SET, missing.code());
    }

    @Test
    void measuredLevelsAreUsedBelowEachSeriesValidityAndTheFitAbove() {
        AlkaliAtom rb = RydbergData.builtIn().atom(Species.parse("Rb-87 I"));
        QuantumDefects set = rb.quantumDefects();
        for (QuantumDefects.Series series : set.series()) {
            for (int n = rb.lowestN(series.l()); n < series.validFromN(); n++) {
                assertEquals(LevelOrigin.MEASURED, rb.level(n, series.l(), series.twoJ()).origin(), n + " " + series);
            }
            assertEquals(LevelOrigin.QUANTUM_DEFECT_FIT, rb.level(series.validFromN() + 1, series.l(), series.twoJ())
                    .origin());
        }
        assertEquals(State.of(5, 0, 1), rb.groundState());
        assertEquals(LevelOrigin.CORE_POLARIZATION, rb.level(40, 5, 11).origin());
        RydbergException core = assertThrows(RydbergException.class, () -> rb.level(4, 1, 3));
        assertEquals(RydbergException.NO_SUCH_STATE, core.code());
        // Na: the lowest member of every series is measured even where the fit would reach it
        AlkaliAtom na = RydbergData.builtIn().atom(Species.parse("Na-23 I"));
        assertEquals(LevelOrigin.MEASURED, na.level(3, 0, 1).origin());
        assertEquals(0.0, na.energyPerCm(State.of(3, 0, 1)), 0.0);
    }

    @Test
    void aFileWithoutItsLimitIsRefusedNamingTheKey() {
        DataFileException e = assertThrows(DataFileException.class, () -> read("quantum-defects-missing-limit.csv"));
        assertEquals(DataFileException.INVALID, e.code());
        assertEquals(List.of("qd.missing-key"), e.problems().stream().map(DataProblem::code).collect(Collectors.toList()));
        assertTrue(e.getMessage().contains("limit-per-cm"), e.getMessage());
    }

    @Test
    void aLevelsIdThatIsNotAnIdIsRefusedWithItsLine() {
        DataFileException e = assertThrows(DataFileException.class, () -> read("quantum-defects-bad-levels-id.csv"));
        assertEquals(List.of("qd.bad-levels:11"), e.problems().stream().map(p -> p.code() + ":" + p.line())
                .collect(Collectors.toList()));
        assertTrue(e.getMessage().contains("'Levels RB 87'"), e.getMessage());
    }

    @Test
    void theBuiltInSetsCarryTheirCorePolarizabilitiesAndLevelsIds() {
        for (Species species : RydbergData.builtIn().species()) {
            QuantumDefects set = RydbergData.builtIn().quantumDefects(species).defects();
            assertEquals(Optional.of(RydbergData.builtIn().levels(species).info().id()), set.levelsId(), species.notation());
            assertTrue(set.corePolarizability().isPresent(), species.notation());
            assertEquals(set.corePolarizability(), RydbergData.builtIn().atom(species).corePolarizability());
        }
    }

    @Test
    void everyBadRowIsReportedWithItsLine() {
        DataFileException e = assertThrows(DataFileException.class, () -> read("quantum-defects-bad-rows.csv"));
        assertEquals(List.of("qd.bad-j:13", "qd.bad-number:14", "qd.duplicate-series:15", "qd.bad-series:16",
                "qd.bad-provenance:17"), e.problems().stream().map(p -> p.code() + ":" + p.line())
                        .collect(Collectors.toList()));
    }

    private static QuantumDefectFiles.Content read(String name) throws Exception {
        try (InputStream in = RydbergDataTest.class.getResourceAsStream("/rydberg/" + name)) {
            return QuantumDefectFiles.read(in, name);
        }
    }
}
