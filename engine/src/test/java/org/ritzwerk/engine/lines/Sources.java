package org.ritzwerk.engine.lines;

import java.util.List;
import java.util.OptionalDouble;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.data.StrengthClass;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;

/** Sources for the line-set tests: nuclei, a rubidium-87 atom and small line lists, written out. */
final class Sources {

    static final Species H = Species.parse("H I");
    static final Species HE_II = Species.parse("He II");
    /** Proton: m_p, spin 1/2, mu_p = 2.79284734463 mu_N, r_p = 0.8414 fm (CODATA 2018). */
    static final Nucleus PROTON = new Nucleus(1, 1, PhysicalConstants.PROTON_MASS.value(), 1,
            OptionalDouble.of(2.79284734463), OptionalDouble.of(0.8414e-15), "CODATA 2018");
    /**
     * He-4: atomic mass 4.00260325413 u (AME2020), spin 0, r = 1.6755 fm (Angeli and Marinova 2013),
     * both from memory as in the engine's UserGuideTest; the tests compare two paths over the same
     * model, so these digits do not enter a check.
     */
    static final Nucleus HELIUM4 = new Nucleus(2, 4, Nucleus.nuclearMassKg(2, 4.00260325413), 0,
            OptionalDouble.empty(), OptionalDouble.of(1.6755e-15), "AME2020; Angeli and Marinova 2013");

    private Sources() {
    }

    static HydrogenLikeModel hydrogen(Tier tier) {
        return HydrogenLikeModel.of(PROTON, tier);
    }

    /** A point-like nucleus of charge z and (for these purposes) infinite mass, 1 kg. */
    static Nucleus infinitelyHeavy(int z) {
        return new Nucleus(z, 2 * z, 1.0, 0, OptionalDouble.empty(), OptionalDouble.empty(), "test");
    }

    /**
     * Rubidium-87 as in the rydberg tests: the Mack 2011 / Li 2003 / Han 2006 quantum defects (as
     * in refdata's built-in set), R_M from the AME2020 mass, the Mack limit, the lowest measured
     * levels (NIST ASD Rb I levels in cm-1, from memory, as in refdata's levels-rb-87) and the core
     * polarizabilities of Berl et al. 2020.
     */
    static AlkaliAtom rubidium() {
        return org.ritzwerk.engine.rydberg.TestAtoms.rubidium();
    }

    /**
     * Three neon lines in standard air (nm), invented intensities and uncertainties (for the
     * conversion checks only; the positions are the familiar 585.2488, 640.2248 and 703.2413 nm
     * of Ne I, from memory), one without an intensity, one with an A value, and one labelled by states.
     */
    static LineList neonInAir() {
        Species ne = Species.parse("Ne I");
        DataSetInfo info = new DataSetInfo("test-ne", DataKind.LAMP_LINES, "test neon", "1",
                Provenance.fromMemory("test"), List.of(ne));
        return LineList.builder(info, Unit.NANOMETRE, Medium.air(), "")
                .add(ne, 585.2488, 0.0002, 500, StrengthClass.STRONG, Double.NaN, null, null, null)
                .add(ne, 640.2248, 0.0001, 1000, StrengthClass.MEDIUM, 1.4e7, "3s2", "2p9", null)
                .add(ne, 703.2413, 0.0003, Double.NaN, null, Double.NaN, null, null, null)
                .build();
    }

    /**
     * Two lines given in cm-1 (vacuum wavenumbers), one labelled by states n l j: invented for the
     * conversion checks (the first near lithium's 2p - 2s line, 14904 cm-1, from memory).
     */
    static LineList wavenumberList() {
        Species li = Species.parse("Li I");
        DataSetInfo info = new DataSetInfo("test-li", DataKind.LINES, "test lithium", "1",
                Provenance.fromMemory("test"), List.of(li));
        return LineList.builder(info, Unit.PER_CENTIMETRE, null, "")
                .add(li, 14904.0, Double.NaN, 10, StrengthClass.WEAK, 3.7e7, "2s1/2", "2p3/2", null)
                .add(li, 12300.0, 0.01, Double.NaN, null, Double.NaN, null, null, null)
                .build();
    }
}
