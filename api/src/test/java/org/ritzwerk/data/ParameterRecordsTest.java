package org.ritzwerk.data;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;

/**
 * The records that describe an alkali atom's data: a quantum-defect set with its optional core
 * polarizabilities and levels id, measured levels, core polarizabilities and model-potential
 * parameters. Every number here is invented for the test.
 */
class ParameterRecordsTest {

    private static final Species RB87 = Species.parse("Rb-87 I");
    private static final DataSetInfo INFO = new DataSetInfo("test-qd", DataKind.QUANTUM_DEFECTS, "test", "1",
            Provenance.published("invented for tests"), List.of(RB87));
    private static final List<QuantumDefects.Series> SERIES = List.of(new QuantumDefects.Series(0, 1, List.of(3.0), 5));
    private static final CorePolarizability CORE = new CorePolarizability(9.0, 38.0, "invented for tests");

    @Test
    void aSetOfSeriesOnlyHasNeitherCoreNorLevels() {
        QuantumDefects bare = new QuantumDefects(INFO, RB87, 33690.0, 109736.0, SERIES);
        assertEquals(Optional.empty(), bare.corePolarizability());
        assertEquals(Optional.empty(), bare.levelsId());
        assertEquals(new QuantumDefects(INFO, RB87, 33690.0, 109736.0, SERIES, Optional.empty(), Optional.empty()),
                bare);
        assertEquals(1, bare.size());
    }

    @Test
    void aSetCarriesItsCoreAndLevelsId() {
        QuantumDefects bare = new QuantumDefects(INFO, RB87, 33690.0, 109736.0, SERIES);
        QuantumDefects whole = bare.withCorePolarizability(CORE).withLevelsId("test-levels");
        assertEquals(Optional.of(CORE), whole.corePolarizability());
        assertEquals(Optional.of("test-levels"), whole.levelsId());
        assertEquals(new QuantumDefects(INFO, RB87, 33690.0, 109736.0, SERIES, Optional.of(CORE),
                Optional.of("test-levels")), whole);
        assertNotEquals(bare, whole);
        QuantumDefects heavier = whole.withRydbergPerCm(109736.5);
        assertEquals(109736.5, heavier.rydbergPerCm(), 0.0);
        assertEquals(whole.corePolarizability(), heavier.corePolarizability());
        assertEquals(whole.levelsId(), heavier.levelsId());
        assertSame(whole.series(), heavier.series());
    }

    @Test
    void aLevelsIdMustBeADataSetId() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new QuantumDefects(INFO, RB87, 33690.0, 109736.0, SERIES, Optional.empty(),
                        Optional.of("Levels RB 87")));
        assertTrue(e.getMessage().contains("'Levels RB 87'"), e.getMessage());
        QuantumDefects bare = new QuantumDefects(INFO, RB87, 33690.0, 109736.0, SERIES);
        assertThrows(IllegalArgumentException.class, () -> bare.withLevelsId(""));
        assertThrows(NullPointerException.class, () -> new QuantumDefects(INFO, RB87, 33690.0, 109736.0, SERIES,
                null, Optional.empty()));
        assertThrows(NullPointerException.class, () -> new QuantumDefects(INFO, RB87, 33690.0, 109736.0, SERIES,
                Optional.empty(), null));
        assertThrows(IllegalArgumentException.class, () -> bare.withRydbergPerCm(Double.NaN));
    }

    @Test
    void corePolarizabilitiesAndMeasuredLevelsAreChecked() {
        assertThrows(IllegalArgumentException.class, () -> new CorePolarizability(0, 1, "x"));
        assertThrows(IllegalArgumentException.class, () -> new CorePolarizability(Double.POSITIVE_INFINITY, 1, "x"));
        assertThrows(IllegalArgumentException.class, () -> new CorePolarizability(1, -1, "x"));
        assertThrows(IllegalArgumentException.class, () -> new CorePolarizability(1, Double.NaN, "x"));
        assertThrows(IllegalArgumentException.class, () -> new CorePolarizability(1, 1, " "));
        MeasuredLevel level = new MeasuredLevel(State.parse("5p3/2"), 12816.5, "invented for tests");
        assertEquals(State.of(5, 1, 3), level.state());
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new MeasuredLevel(State.parse("5p3/2"), -1, "x"));
        assertTrue(e.getMessage().contains("5p3/2"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> new MeasuredLevel(State.parse("5p3/2"), Double.NaN, "x"));
        assertThrows(IllegalArgumentException.class, () -> new MeasuredLevel(State.parse("5p3/2"), 1, ""));
    }

    @Test
    void theLastParameterSetServesEveryHigherL() {
        ModelPotential.Parameters s = new ModelPotential.Parameters(3.0, 1.0, -9.0, 0.2, 1.6);
        ModelPotential.Parameters p = new ModelPotential.Parameters(4.0, 1.5, -7.0, 0.1, 1.8);
        ModelPotential potential = new ModelPotential(37, 9.0, List.of(s, p), "invented for tests");
        assertSame(s, potential.parametersFor(0));
        assertSame(p, potential.parametersFor(1));
        assertSame(p, potential.parametersFor(7));
        assertThrows(IllegalArgumentException.class, () -> potential.parametersFor(-1));
        assertThrows(IllegalArgumentException.class, () -> new ModelPotential(37, 9.0, List.of(), "x"));
        assertThrows(IllegalArgumentException.class, () -> new ModelPotential(0, 9.0, List.of(s), "x"));
        assertThrows(IllegalArgumentException.class, () -> new ModelPotential.Parameters(1, 1, 1, 1, 0));
    }
}
