package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.LineTable;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.quantity.Frequency;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.refdata.DataContext;

/** The README's library example that spans engine and refdata, compiled and run. */
class UserGuideTest {

    @Test
    void linesOfAOneElectronIonWithRates() {
        DataContext data = DataContext.builtIn();
        Nucleus helium4 = data.nucleus(Species.parse("He II"));
        HydrogenLikeLines lines = HydrogenLikeLines.of(HydrogenLikeModel.of(helium4, Tier.QED));
        LineTable table = lines.multiplets(10, Frequency.of(635, Unit.TERAHERTZ).inHertz(),
                Frequency.of(645, Unit.TERAHERTZ).inHertz());
        double tau2p = HydrogenLikeLines.of(HydrogenLikeModel.of(
                data.nucleus(Species.parse("H")), Tier.QED)).lifetime(2, 1, 1);

        assertEquals(1, table.size());
        assertEquals("4686 (4-3)", table.lineName(0));                 // He II 4686, the 4-3 line
        assertEquals(java.util.Optional.of("Fowler"), table.series(0));
        // He II 4686, 4685.70 A in air (Sansonetti & Martin handbook; recalled), 468.701 nm in
        // vacuum by the standard-air formula, c / 468.701 nm = 639.62 THz by hand.
        assertEquals(639.62, table.frequency(0) / 1e12, 0.01);
        // 1 / A(2p -> 1s), A = 6.2649e8 s^-1 (Wiese & Fuhr, J. Phys. Chem. Ref. Data 38, 565 (2009)).
        assertEquals(1.596e-9, tau2p, 1e-12);
    }
}
