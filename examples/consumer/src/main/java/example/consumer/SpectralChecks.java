package example.consumer;

import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.calibrate.DispersionFit;
import org.ritzwerk.engine.calibrate.DispersionSolution;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.LineTable;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Frequency;
import org.ritzwerk.quantity.Wavelength;
import org.ritzwerk.refdata.DataContext;

/**
 * A few library calls, one from each published module, as a user's program makes them: an air
 * wavelength into vacuum (api), the Balmer-alpha line of H I from the built-in nuclear data
 * (refdata + engine), and a dispersion fit of a spectrometer on invented (pixel, wavelength)
 * pairs (engine, through its numerics dependency).
 *
 * <p>The program makes one {@link DataContext} in {@link #main} and passes it to every call that
 * needs data: a context reads each data set when first asked and keeps it, and is safe to use from
 * many threads, so building one per call would only repeat that first-use work.
 */
public final class SpectralChecks {

    private SpectralChecks() {
    }

    /**
     * @param airNanometres a wavelength in standard air, nm
     * @return the same light's wavelength in vacuum, nm
     */
    public static double vacuumNanometres(double airNanometres) {
        return Wavelength.ofNanometres(airNanometres, Medium.air()).toWavelength(Medium.vacuum()).inNanometres();
    }

    /**
     * @param data the program's data context (made once and shared), for the hydrogen nucleus
     * @return the n = 3 -> 2 multiplet of H I (the QED tier), the only line of n &lt;= 3 between
     *         650 and 660 nm in air
     */
    public static LineTable balmerAlpha(DataContext data) {
        Nucleus hydrogen = data.nucleus(Species.parse("H I"));
        HydrogenLikeLines lines = HydrogenLikeLines.of(HydrogenLikeModel.of(hydrogen, Tier.QED));
        return lines.multiplets(3, Wavelength.ofNanometres(650, Medium.air()),
                Wavelength.ofNanometres(660, Medium.air()));
    }

    /**
     * @param table a line table
     * @param i     a row of it
     * @return the line's wavelength in standard air, nm
     */
    public static double airNanometres(LineTable table, int i) {
        return Frequency.ofHertz(table.frequency(i)).toWavelength(Medium.air()).inNanometres();
    }

    /**
     * Invented calibration pairs: ten lines on a detector whose wavelength is exactly
     * 500 nm + 0.05 nm p + 2e-6 nm p^2 at pixel p.
     *
     * @return the quadratic dispersion fitted to them, without clipping
     */
    public static DispersionSolution inventedCalibration() {
        double[] pixel = new double[10];
        double[] nanometres = new double[10];
        for (int i = 0; i < pixel.length; i++) {
            pixel[i] = 100 + 200 * i;
            nanometres[i] = inventedTruth(pixel[i]);
        }
        return DispersionFit.ofDegree(2).withoutClipping().fit(pixel, null, nanometres, null, Medium.air());
    }

    /**
     * @param pixel a pixel position
     * @return the invented detector's true wavelength there, nm
     */
    public static double inventedTruth(double pixel) {
        return 500 + 0.05 * pixel + 2e-6 * pixel * pixel;
    }

    /**
     * Prints the three results.
     *
     * @param args none
     */
    public static void main(String[] args) {
        DataContext data = DataContext.builtIn(); // one context for the whole program, shared
        System.out.println("656.279 nm air = " + vacuumNanometres(656.279) + " nm vacuum");
        LineTable alpha = balmerAlpha(data);
        System.out.println("H I " + alpha.lineName(0) + ": " + airNanometres(alpha, 0) + " nm air, A = "
                + alpha.einsteinA(0) + " s-1");
        DispersionSolution solution = inventedCalibration();
        System.out.println("invented calibration: pixel 1000 at " + solution.wavelengthAt(1000) + " nm");
    }
}
