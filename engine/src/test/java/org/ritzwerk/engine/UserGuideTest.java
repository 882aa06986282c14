package org.ritzwerk.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.convert.SpectralArrays;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.LineTable;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.plasma.BalmerPlasmaFit;
import org.ritzwerk.engine.plasma.BoltzmannPlot;
import org.ritzwerk.engine.plasma.IonisationBalance;
import org.ritzwerk.engine.profile.BalmerStark;
import org.ritzwerk.engine.profile.Broadening;
import org.ritzwerk.engine.profile.Faddeeva;
import org.ritzwerk.engine.profile.Profiles;
import org.ritzwerk.engine.synth.Continuum;
import org.ritzwerk.engine.synth.FastLineRenderer;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.LineRenderer;
import org.ritzwerk.engine.synth.Noise;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Renderer;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.engine.synth.SyntheticSpectrum;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.quantity.Wavelength;

/** The engine examples of the README, compiled and run. */
class UserGuideTest {

    @Test
    void convertAWholeColumn() {
        double[] airNanometres = {412.337, 577.915, 731.26};
        double[] wavenumbers = new double[airNanometres.length];

        SpectralArrays.convert(airNanometres, Unit.NANOMETRE, Medium.air(),
                Unit.PER_CENTIMETRE, null, wavenumbers);

        // By hand: 577.915 nm in standard air is 578.0753 nm in vacuum (Morton 2000, eq. 8), 17 298.8 cm^-1.
        assertEquals(17298.8, wavenumbers[1], 0.05);
    }

    @Test
    void linesOfAOneElectronIonInAWindow() {
        // The nucleus comes from refdata (NuclearData.builtIn().nucleus(Species.parse("He II")));
        // here it is written out so the engine example stands alone: He-4, spin 0, r = 1.68 fm.
        Nucleus helium4 = new Nucleus(2, 4, Nucleus.nuclearMassKg(2, 4.00260325413), 0, OptionalDouble.empty(),
                OptionalDouble.of(1.6755e-15), "example");
        HydrogenLikeLines lines = HydrogenLikeLines.of(HydrogenLikeModel.of(helium4, Tier.QED));

        double from = Wavelength.ofNanometres(460, Medium.air()).toFrequency().inHertz();
        double to = Wavelength.ofNanometres(470, Medium.air()).toFrequency().inHertz();
        LineTable table = lines.multiplets(10, to, from);

        assertEquals(1, table.size());
        assertEquals("4686 (4-3)", table.lineName(0));                // He II 4686, the 4-3 line
        assertEquals("4-3", table.shells(0));
        assertEquals(java.util.Optional.of("Fowler"), table.series(0)); // He II n -> 3
        double airNm = Medium.air().fromVacuum(PhysicalConstants.C / table.frequency(0)) * 1e9;
        // He II 4686 in air, 4685.70 A (Sansonetti & Martin handbook, He II strong lines; recalled,
        // from memory; the QED tier computes it independently).
        assertEquals(468.57, airNm, 0.01);
        double einsteinA = table.einsteinA(0);                         // s^-1, Z^4 times hydrogen's
        // Hydrogen's 4 -> 3 multiplet A = 8.9860e6 s^-1 (Wiese & Fuhr 2009, as in PublishedHydrogenTest)
        // times Z^4 = 16; the reduced-mass difference stays inside the 1 %.
        assertEquals(16 * 8.9860e6, einsteinA, 0.01 * 16 * 8.9860e6);
    }

    @Test
    void aVoigtProfileFromTemperatureAndDecayRates() {
        // H-alpha at 456.81 THz from hydrogen atoms at 5000 K; natural width of n = 3 -> 2
        // from rates of about 1e8 s^-1 (illustrative round numbers).
        double nu = 456.81e12;
        double mass = 1.00783 * PhysicalConstants.ATOMIC_MASS_CONSTANT.value();
        double gaussian = Broadening.dopplerFwhm(nu, 5000, mass);          // Hz, about 23 GHz (0.033 nm)
        double lorentz = Broadening.naturalFwhm(1.0e8, 0.6e8);             // Hz, about 25 MHz
        double peak = Profiles.voigt(0, gaussian, lorentz);                // per Hz, unit area
        double width = Profiles.voigtFwhm(gaussian, lorentz);

        // By hand: 456.81 THz x 7.1623e-7 x sqrt(5000 / 1.00783) = 23.05 GHz (see BroadeningTest),
        // and (1.0e8 + 0.6e8) s^-1 / (2 pi) = 25.46 MHz.
        assertEquals(23.0e9, gaussian, 0.1e9);
        assertEquals(25.5e6, lorentz, 0.1e6);
        assertEquals(peak / 2, Profiles.voigt(width / 2, gaussian, lorentz), 1e-3 * peak);
        double[] w = Faddeeva.w(2.5, 0.7);                                  // {Re, Im} of w(2.5 + 0.7i)
        assertEquals(0.07508765293733201, w[0], 1e-12);                     // scipy.special.wofz 1.10.1
        assertEquals(0.21954582524890132, w[1], 1e-12);
    }

    @Test
    void anExcitationTemperatureFromLineIntensities() {
        // Invented photon counts of four lines from a gas at 7000 K, 3 % uncertain.
        double ev = 1.602176634e-19;
        double[] upperEnergyJ = {10.2 * ev, 12.09 * ev, 12.75 * ev, 13.05 * ev};
        double[] upperWeight = {8, 18, 32, 50};
        double[] einsteinA = {4.7e8, 5.6e7, 8.4e6, 2.5e6};
        double[] intensity = new double[4];
        double[] intensitySigma = new double[4];
        for (int i = 0; i < 4; i++) {
            intensity[i] = 1e20 * upperWeight[i] * einsteinA[i]
                    * Math.exp(-upperEnergyJ[i] / (PhysicalConstants.K * 7000));
            intensitySigma[i] = 0.03 * intensity[i];
        }

        BoltzmannPlot.Fit fit = BoltzmannPlot.fit(BoltzmannPlot.Counting.PHOTONS, intensity, intensitySigma,
                upperEnergyJ, upperWeight, einsteinA, null);

        assertEquals(7000, fit.temperature(), 1e-6);
        assertEquals(4, fit.lines());
    }

    @Test
    void linesIntoDetectorPixels() {
        // An invented pair of lines near 656.5 nm, Doppler and natural widths in nm.
        double[] centresNm = {656.2025, 656.9};
        double[] fluxes = {1000, 250};
        double[] gaussianFwhmNm = {0.02, 0.02};
        double[] lorentzFwhmNm = {0.001, 0.003};

        PixelGrid grid = PixelGrid.linear(655, 658, 600);
        double[] pixels = new double[grid.pixels()];
        new LineRenderer(grid, Instrument.ofResolvingPower(20_000), LineRenderer.DEFAULT_WINDOW)
                .render(centresNm, fluxes, gaussianFwhmNm, lorentzFwhmNm, pixels);

        double total = 0;
        for (double p : pixels) {
            total += p;
        }
        double bound = 1000 * LineRenderer.truncationBound(Math.hypot(0.02, 656.2025 / 20_000), 0.001, 0.5)
                + 250 * LineRenderer.truncationBound(Math.hypot(0.02, 656.9 / 20_000), 0.003, 0.5);
        assertEquals(1250, total, bound + 1e-6);
        int brightest = 0;
        for (int p = 1; p < pixels.length; p++) {
            brightest = pixels[p] > pixels[brightest] ? p : brightest;
        }
        assertEquals(240, brightest);                                    // 656.200-656.205 nm

        // The same lines through the Fourier domain (for large line lists): whole profiles, within
        // 1e-4 of the brightest pixel of the exact result.
        double[] fast = new double[grid.pixels()];
        new FastLineRenderer(grid, Instrument.ofResolvingPower(20_000))
                .render(centresNm, fluxes, gaussianFwhmNm, lorentzFwhmNm, fast);
        for (int p = 0; p < pixels.length; p++) {
            assertEquals(pixels[p], fast[p], 1e-4 * pixels[brightest]);
        }

        double scale = 1e-9;                                            // invented: counts per W m^-2 sr^-1
        Continuum.render(grid, nm -> 1e-9 * Continuum.planckPhotonsPerWavelength(nm * 1e-9, 4500) * scale, pixels);
        double[] clean = pixels.clone();
        Noise.apply(pixels, 4.0, 2026L, pixels);                        // Poisson + 4-count read noise
        double[] again = clean.clone();
        Noise.apply(again, 4.0, 2026L, again);
        assertEquals(java.util.Arrays.toString(pixels), java.util.Arrays.toString(again));
        assertTrue(clean[0] > 0);
    }

    @Test
    void balmerLinesOfAHydrogenDeuteriumPlasma() {
        // Proton and deuteron masses: CODATA 2018. The plasma (9000 K, 3e20 m^-3, D/H 0.5) is invented.
        HydrogenLikeModel h = HydrogenLikeModel.of(new Nucleus(1, 1, PhysicalConstants.PROTON_MASS.value(), 1,
                OptionalDouble.empty(), OptionalDouble.empty(), "CODATA 2018"), Tier.DIRAC);
        HydrogenLikeModel d = HydrogenLikeModel.of(new Nucleus(1, 2, PhysicalConstants.DEUTERON_MASS.value(), 2,
                OptionalDouble.empty(), OptionalDouble.empty(), "CODATA 2018"), Tier.DIRAC);
        PixelGrid grid = PixelGrid.linear(400, 670, 5400);             // 0.05 nm pixels, standard air
        double[] counts = Scene.builder(grid).medium(Medium.air()).temperature(9000).electronDensity(3e20)
                .nMax(8).hydrogenLike(Species.parse("H I"), h, 1).hydrogenLike(Species.parse("D I"), d, 0.5)
                .instrument(Instrument.ofFwhm(0.10)).peakCounts(40_000).noise(6, 7L).build().render(1).counts();
        double[] nm = java.util.stream.IntStream.range(0, grid.pixels()).mapToDouble(grid::centre).toArray();

        BalmerPlasmaFit.Result fit = BalmerPlasmaFit.defaults().withInstrumentFwhm(0.10)
                .fit(BalmerPlasmaFit.problem(nm, Medium.air(), counts).readNoise(6)
                        .emitter(h).companion(d, 0.5).line(3).line(4).line(5).line(6).build());

        assertEquals(4, fit.lines().size());
        assertEquals(9000, fit.temperature().orElseThrow().kelvin(), 450);       // within 5 %
        assertEquals(3e20, fit.density().orElseThrow().perCubicMetre(), 0.75e20); // within 25 %
    }

    @Test
    void aWholeScene() {
        // Proton and alpha particle (6.6446573357e-27 kg), both CODATA 2018 (Tiesinga et al.,
        // Rev. Mod. Phys. 93, 025010 (2021); the alpha mass has the digits of Debian scipy 1.10.1's
        // scipy.constants.physical_constants["alpha particle mass"]).
        HydrogenLikeModel hydrogen = HydrogenLikeModel.of(new Nucleus(1, 1, PhysicalConstants.PROTON_MASS.value(), 1,
                OptionalDouble.empty(), OptionalDouble.empty(), "CODATA 2018"), Tier.DIRAC);
        HydrogenLikeModel heliumIon = HydrogenLikeModel.of(new Nucleus(2, 4, 6.6446573357e-27, 0,
                OptionalDouble.empty(), OptionalDouble.empty(), "CODATA 2018"), Tier.DIRAC);

        Scene scene = Scene.builder(PixelGrid.linear(380, 700, 20_000))
                .hydrogenLike(Species.parse("H I"), hydrogen, 1)
                .hydrogenLike(Species.parse("He II"), heliumIon, 0.1)          // relative numbers of atoms
                .temperature(25_000).electronDensity(1e22)                     // Saha balance, Stark widths
                .medium(Medium.air()).instrument(Instrument.ofResolvingPower(8000))
                .continuum(nm -> Continuum.planckPhotonsPerWavelength(nm * 1e-9, 25_000), 100)
                .noise(3.0, 42L)
                .renderer(Renderer.AUTO)                                       // or EXACT, FAST
                .build();
        SyntheticSpectrum spectrum = scene.render(4);                       // counts(), expectedCounts(), lines()

        double[] hydrogenStages = IonisationBalance.hydrogen(hydrogen, 12_000, 1e21);       // H I, H II
        double ne = BalmerStark.electronDensity(BalmerStark.Line.BETA, 1.2);                // m^-3 from 1.2 nm

        assertEquals(20_000, spectrum.counts().length);
        assertTrue(scene.lines().size() > 20);
        assertEquals(1, hydrogenStages[0] + hydrogenStages[1], 1e-15);
        // 1e23 (1.2 / 4.8)^(1 / 0.68116) = 1.31e22 m^-3 (Gigosos et al. 2003 fit, by hand).
        assertEquals(1.31e22, ne, 0.01e22);
    }
}
