package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.LineTable;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.plasma.IonisationBalance;
import org.ritzwerk.quantity.Energy;
import org.ritzwerk.quantity.Unit;

/** The README's typed-result lines (level energies, a line by its two levels, the Saha ratio), compiled and run. */
class TypedResultsGuideTest {

    @Test
    void typedLevelEnergiesALineByItsLevelsAndTheSahaRatio() {
        DataContext data = DataContext.builtIn();
        double chiJoules = 13.6 * PhysicalConstants.E;   // an invented round ionisation energy

        // --- README: typed level energies and one line by its two levels ---
        HydrogenLikeModel h = HydrogenLikeModel.of(data.nucleus(Species.parse("H")), Tier.QED);
        Energy above1s = h.excitationEnergy(2, 1, 3);                      // 2p3/2, an Energy (J, cm-1, eV)
        Energy toIonise = h.ionisationEnergy(1, 0, 1);                     // positive, unlike energy(n, l, 2j)
        LineTable alpha = HydrogenLikeLines.of(h).line(3, 2, 5, 2, 1, 3);   // 3d5/2 -> 2p3/2: frequency, A, f, S
        double ratio = IonisationBalance.sahaRatio(12_000, 1e21, chiJoules, 2, 1);        // n(II)/n(I); sahaPrefactor(T)
        // --- end ---

        // 2p3/2 at 82259.2850014 cm-1 and the ionisation energy 109678.77174307 cm-1 (A. E. Kramida,
        // At. Data Nucl. Data Tables 96, 586 (2010), as in the engine's PublishedHydrogenTest).
        assertEquals(82259.2850014, above1s.toWavenumber().valueIn(Unit.PER_CENTIMETRE), 1e-4);
        assertEquals(109678.77174307, toIonise.toWavenumber().valueIn(Unit.PER_CENTIMETRE), 1e-3);
        assertEquals(1, alpha.size());
        double expected = IonisationBalance.sahaPrefactor(12_000) / 1e21 / 2
                * Math.exp(-chiJoules / (PhysicalConstants.K * 12_000));
        assertEquals(expected, ratio, 1e-12 * expected);
    }
}
