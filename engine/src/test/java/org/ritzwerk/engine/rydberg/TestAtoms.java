package org.ritzwerk.engine.rydberg;

import java.util.ArrayList;
import java.util.List;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.CorePolarizability;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.MeasuredLevel;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.data.QuantumDefects;

/** Small atoms for the engine's own tests (the built-in data sets live in refdata). */
public final class TestAtoms {

    static final double R_INF_PER_CM = PhysicalConstants.RYDBERG.value() / 100;

    private TestAtoms() {
    }

    /** Hydrogen with an infinitely heavy nucleus: every quantum defect zero, R_M = R_inf, limit R_inf. */
    static AlkaliAtom hydrogen() {
        return AlkaliAtom.of(defects("test-hydrogen", new Species(1, 0, 0), R_INF_PER_CM, R_INF_PER_CM,
                List.of(new QuantumDefects.Series(0, 1, List.of(0.0), 1))), List.of(), null);
    }

    /**
     * Rubidium-87-like: the Mack 2011 / Li 2003 / Han 2006 series (as in refdata's built-in set,
     * rounded valid-from), Rb-87 R_M from the AME2020 mass, the Mack limit, and the lowest
     * measured levels (NIST ASD in cm-1, from memory, as in refdata) so that the ground and D lines
     * exist; core polarizabilities as in refdata (Berl et al. 2020).
     */
    public static AlkaliAtom rubidium() {
        double rydberg = R_INF_PER_CM / (1 + 5.48579909065e-4 / (86.909180529 - 5.48579909065e-4));
        List<QuantumDefects.Series> series = new ArrayList<>();
        series.add(new QuantumDefects.Series(0, 1, List.of(3.1311807, 0.1787), 10));
        series.add(new QuantumDefects.Series(1, 1, List.of(2.6548849, 0.2900), 15));
        series.add(new QuantumDefects.Series(1, 3, List.of(2.6416737, 0.2950), 15));
        series.add(new QuantumDefects.Series(2, 3, List.of(1.3480948, -0.6054), 10));
        series.add(new QuantumDefects.Series(2, 5, List.of(1.3464622, -0.5940), 10));
        series.add(new QuantumDefects.Series(3, 5, List.of(0.0165192, -0.085), 7));
        series.add(new QuantumDefects.Series(3, 7, List.of(0.0165437, -0.086), 7));
        QuantumDefects set = defects("test-rb", new Species(37, 87, 0), 33690.804799, rydberg, series);
        List<MeasuredLevel> low = new ArrayList<>();
        String src = "NIST ASD Rb I levels, from memory, as in refdata's levels-rb-87";
        low.add(new MeasuredLevel(State.of(5, 0, 1), 0, src));
        low.add(new MeasuredLevel(State.of(5, 1, 1), 12578.950, src));
        low.add(new MeasuredLevel(State.of(5, 1, 3), 12816.545, src));
        low.add(new MeasuredLevel(State.of(4, 2, 5), 19355.202, src));
        low.add(new MeasuredLevel(State.of(4, 2, 3), 19355.648, src));
        low.add(new MeasuredLevel(State.of(4, 3, 7), 26792.091, src));
        low.add(new MeasuredLevel(State.of(4, 3, 5), 26792.117, src));
        return AlkaliAtom.of(set, low, new CorePolarizability(9.116, 38.4,
                "S. Berl et al., Phys. Rev. A 102, 062818 (2020), read in its abstract"));
    }

    static QuantumDefects defects(String id, Species species, double limit, double rydberg,
            List<QuantumDefects.Series> series) {
        DataSetInfo info = new DataSetInfo(id, DataKind.QUANTUM_DEFECTS, "test set", "1",
                Provenance.computedBy("test"), List.of(species));
        return new QuantumDefects(info, species, limit, rydberg, series);
    }
}
