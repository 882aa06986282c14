package example.consumer;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.calibrate.DispersionSolution;
import org.ritzwerk.engine.hydrogenic.LineTable;
import org.ritzwerk.quantity.Wavelength;
import org.ritzwerk.refdata.DataContext;

/** Runs the library calls of {@link SpectralChecks} against the installed artifacts. */
class SpectralChecksTest {

    /** The data context these calls share, made once and passed in, as a program does. */
    private final DataContext data = DataContext.builtIn();

    @Test
    void ritzwerkIsOnTheModulePath() {
        // Named modules, not jars on the class path: the artifacts' module descriptors resolved.
        assertTrue(SpectralChecks.class.getModule().isNamed(), "the consumer runs as a module");
        assertEquals("org.ritzwerk.api", Wavelength.class.getModule().getName());
        assertEquals("org.ritzwerk.refdata", DataContext.class.getModule().getName());
        assertEquals("org.ritzwerk.engine", LineTable.class.getModule().getName());
    }

    @Test
    void airWavelengthToVacuum() {
        // The README's `convert "656.279 nm air" --to "nm vacuum"` example prints
        // 656.4602977309532 nm. The ratio is the refractive index of standard air (Morton 2000,
        // eq. 8, the README's default air model) at 656 nm, n = 1.000276 (from memory; checked:
        // the H-alpha wavelengths 656.279 nm air and 656.461 nm vacuum give n - 1 = 2.77e-4).
        double vacuum = SpectralChecks.vacuumNanometres(656.279);
        assertEquals(656.4602977, vacuum, 1e-6);
        assertEquals(1.000276, vacuum / 656.279, 1e-6);
    }

    @Test
    void balmerAlphaOfHydrogen() {
        // H I Balmer alpha, 656.279 nm in air (NIST Atomic Spectra Database, from memory);
        // checked against the Rydberg formula: R_H (1/4 - 1/9) = 109677.58 cm-1 * 5/36
        // = 15233.0 cm-1, i.e. 656.47 nm in vacuum, 656.29 nm in air, before fine structure.
        LineTable alpha = SpectralChecks.balmerAlpha(data);
        assertEquals(1, alpha.size());
        assertEquals("Balmer alpha", alpha.lineName(0));
        assertEquals(3, alpha.upperN(0));
        assertEquals(2, alpha.lowerN(0));
        assertEquals(656.279, SpectralChecks.airNanometres(alpha, 0), 0.001);
        // The README's `lines --species "H I"` table: A = 4.4103e+07 s-1 for the multiplet.
        assertEquals(4.4103e7, alpha.einsteinA(0), 0.0001e7);
    }

    @Test
    void dispersionFitRecoversTheInventedDetector() {
        DispersionSolution solution = SpectralChecks.inventedCalibration();
        assertEquals(2, solution.degree());
        for (double pixel : new double[] {0, 1000, 1937.5}) {
            assertEquals(SpectralChecks.inventedTruth(pixel), solution.wavelengthAt(pixel), 1e-9);
        }
        assertEquals(0.05 + 4e-6 * 1000, solution.dispersionAt(1000), 1e-12); // nm per pixel
    }
}
