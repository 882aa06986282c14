package org.ritzwerk.benchmarks;

import java.util.List;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.CorePolarizability;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.data.QuantumDefects;
import org.ritzwerk.engine.rydberg.AlkaliAtom;

/**
 * Rb-87 with the s, p, d and f series of refdata's built-in set (W. Li et al., Phys. Rev. A 67,
 * 052502 (2003); M. Mack et al., Phys. Rev. A 83, 052515 (2011); J. Han et al., Phys. Rev. A 74,
 * 054502 (2006)), the AME2020 mass and the Berl et al. (2020) core polarizabilities, for the
 * Rydberg benchmarks (n from 15 up; no measured low levels).
 */
final class RubidiumFixture {

    private RubidiumFixture() {
    }

    static AlkaliAtom rubidium() {
        double rInf = PhysicalConstants.RYDBERG.value() / 100;
        double electronU = 5.48579909065e-4;
        double rydberg = rInf / (1 + electronU / (86.909180529 - electronU));
        Species rb87 = new Species(37, 87, 0);
        QuantumDefects defects = new QuantumDefects(new DataSetInfo("bench-rb-87", DataKind.QUANTUM_DEFECTS,
                "benchmark set", "1", Provenance.published("Li et al. 2003; Mack et al. 2011; Han et al. 2006"),
                List.of(rb87)), rb87, 33690.804799, rydberg, List.of(
                        new QuantumDefects.Series(0, 1, List.of(3.1311807, 0.1787), 10),
                        new QuantumDefects.Series(1, 1, List.of(2.6548849, 0.2900), 15),
                        new QuantumDefects.Series(1, 3, List.of(2.6416737, 0.2950), 15),
                        new QuantumDefects.Series(2, 3, List.of(1.3480948, -0.6054), 10),
                        new QuantumDefects.Series(2, 5, List.of(1.3464622, -0.5940), 10),
                        new QuantumDefects.Series(3, 5, List.of(0.0165192, -0.085), 7),
                        new QuantumDefects.Series(3, 7, List.of(0.0165437, -0.086), 7)));
        return AlkaliAtom.of(defects, List.of(), new CorePolarizability(9.116, 38.4,
                "S. Berl et al., Phys. Rev. A 102, 062818 (2020)"));
    }
}
