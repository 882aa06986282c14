package org.ritzwerk.engine.identify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.plasma.PlasmaEstimate;
import org.ritzwerk.engine.profile.BalmerStark;
import org.ritzwerk.engine.profile.Broadening;
import org.ritzwerk.engine.profile.Profiles;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;

/**
 * The identification job end to end on a Balmer spectrum made here from the engine's own
 * hydrogen lines, moved by a known velocity, with photon counts that follow a Boltzmann
 * population at a known temperature and an H-alpha width made of a known Stark width, Doppler
 * width and instrument width: the job must find the velocity, match every line, and give back the
 * temperature (the Boltzmann relation, common practice) and the density (the inverse of
 * {@link BalmerStark#fwhmNanometres}).
 */
class IdentificationJobTest {

    private static final Species H = Species.parse("H I");
    private static final double VELOCITY = 42e3;      // m/s, invented
    private static final double TEMPERATURE = 9000;   // K, invented
    private static final double DENSITY = 3e22;       // m^-3, invented
    private static final double INSTRUMENT = 0.05;    // nm FWHM, invented

    @Test
    void velocityMatchesTemperatureAndDensityComeBack() {
        HydrogenLikeModel model = HydrogenLikeModel.of(Scenes.PROTON, Tier.QED);
        LineCatalog rest = Candidates.inWindow(370e-9, 700e-9).hydrogenLike(H, model, 12, false).build().catalog();
        double ground = model.energy(1, 0, 1);
        int n = rest.size();
        double[] nm = new double[n];
        double[] sigma = new double[n];
        double[] photons = new double[n];
        double[] width = new double[n];
        double z = VELOCITY / PhysicalConstants.C;
        Candidates candidates = Candidates.inWindow(300e-9, 800e-9).hydrogenLike(H, model, 12, false).build();
        for (int j = 0; j < n; j++) {
            nm[j] = rest.wavelength(j) * (1 + z) * 1e9;
            sigma[j] = 2e-4;
            Candidates.Multiplet m = candidates.multiplet(rest, j);
            assertNotNull(m, rest.label(j));
            photons[j] = m.weight() * m.einsteinA() * Math.exp(-m.upperEnergy() / (PhysicalConstants.K * TEMPERATURE));
            width[j] = Double.NaN;
            if (m.upperN() == 3 && m.lowerN() == 2) {
                double mass = model.nucleus().massKg() + PhysicalConstants.ELECTRON_MASS.value();
                double doppler = Broadening.dopplerFwhm(m.frequency(), TEMPERATURE, mass) / m.frequency()
                        * rest.wavelength(j) * 1e9;
                double stark = BalmerStark.fwhmNanometres(BalmerStark.Line.ALPHA, DENSITY);
                width[j] = Profiles.voigtFwhm(Math.hypot(INSTRUMENT, doppler), stark);
            }
        }
        PeakList peaks = PeakList.of(nm, sigma, photons, Unit.NANOMETRE, Medium.vacuum());

        IdentificationSearch search = IdentificationSearch.of(Identifier.of(Tolerance.parse("5 sigma")))
                .withVelocitySearch(100e3);
        double[] window = search.candidateWindow(peaks);
        assertTrue(window[0] < rest.wavelength(0) && window[1] > rest.wavelength(n - 1) * (1 + z));
        Candidates found = Candidates.inWindow(window[0], window[1]).hydrogenLike(H, model, 12, false).build();
        IdentificationSearch.Report report = search.run(peaks, found.catalog());

        assertEquals(VELOCITY, report.velocity().orElseThrow().velocity(), 20, "m/s");
        assertTrue(report.offset().isEmpty());
        assertEquals(n, report.identification().count(Identification.MATCHED));

        List<PlasmaEstimate.Row> rows = PlasmaEstimate.defaults().withInstrumentFwhm(INSTRUMENT)
                .estimate(new PlasmaEstimate.Peaks(nm, Unit.NANOMETRE, Medium.vacuum(), photons, width),
                        report.identification(), report.lines(), found);
        PlasmaEstimate.Row t = rows.get(0);
        assertEquals(PlasmaEstimate.Quantity.EXCITATION_TEMPERATURE, t.quantity());
        assertEquals(TEMPERATURE, t.value().orElseThrow(), 1e-6 * TEMPERATURE);
        PlasmaEstimate.Row ne = rows.stream().filter(r -> r.quantity() == PlasmaEstimate.Quantity.ELECTRON_DENSITY)
                .filter(r -> r.value().isPresent()).findFirst().orElseThrow();
        // The peak is moved by the velocity, so its width in nm is (1 + z) wider than at rest: a 1e-4
        // relative effect on the width, about 1.5e-4 on the density.
        assertEquals(DENSITY, ne.value().getAsDouble(), 1e-3 * DENSITY, ne.note());
        assertTrue(rows.stream().anyMatch(r -> r.note().equals("the peak states no width")));

        // Intensities that rise with upper-level energy (exp(+E / kT)): no positive temperature
        // fits them; the estimate says so in its row instead of failing (a measured peak list can
        // give such intensities; common practice).
        double[] rising = new double[n];
        for (int j = 0; j < n; j++) {
            Candidates.Multiplet m = candidates.multiplet(rest, j);
            rising[j] = m.weight() * m.einsteinA() * Math.exp(m.upperEnergy() / (PhysicalConstants.K * TEMPERATURE));
        }
        PlasmaEstimate.Row none = PlasmaEstimate.defaults().withInstrumentFwhm(INSTRUMENT)
                .estimate(new PlasmaEstimate.Peaks(nm, Unit.NANOMETRE, Medium.vacuum(), rising, width),
                        report.identification(), report.lines(), found).get(0);
        assertEquals(PlasmaEstimate.Quantity.EXCITATION_TEMPERATURE, none.quantity());
        assertTrue(none.value().isEmpty() && none.uncertainty().isEmpty());
        assertTrue(none.note().startsWith("the Boltzmann plot rises"), none.note());

        // Peaks that are not the identification's were paired silently with its lines (or failed
        // with an index out of bounds): another count, or the same peaks in another order, is refused.
        double[] one = {nm[0]};
        IllegalArgumentException fewer = assertThrows(IllegalArgumentException.class, () -> PlasmaEstimate.defaults()
                .estimate(new PlasmaEstimate.Peaks(one, Unit.NANOMETRE, Medium.vacuum(), new double[1], new double[1]),
                        report.identification(), report.lines(), found));
        assertTrue(fewer.getMessage().contains("the identification has " + n + " peaks"), fewer.getMessage());
        double[] swapped = nm.clone();
        swapped[0] = nm[1];
        swapped[1] = nm[0];
        IllegalArgumentException order = assertThrows(IllegalArgumentException.class, () -> PlasmaEstimate.defaults()
                .estimate(new PlasmaEstimate.Peaks(swapped, Unit.NANOMETRE, Medium.vacuum(), photons, width),
                        report.identification(), report.lines(), found));
        assertTrue(order.getMessage().startsWith("peak 0 lies elsewhere"), order.getMessage());
    }

    /** NaN marks one peak's uncertainty or intensity as not given, as the peak-file readers write it. */
    @Test
    void notGivenUncertaintiesAndIntensitiesAreNaN() {
        PeakList peaks = PeakList.of(new double[] {500, 600, 700}, new double[] {0.01, Double.NaN, 0.02},
                new double[] {Double.NaN, 5, 7}, Unit.NANOMETRE, Medium.vacuum());
        assertEquals(0, peaks.sigma(1));
        assertTrue(peaks.sigma(0) > 0 && peaks.sigma(2) > 0);
        assertTrue(Double.isNaN(peaks.intensity(0)));
        assertEquals(5, peaks.intensity(1));
        assertThrows(IllegalArgumentException.class, () -> PeakList.of(new double[] {500}, new double[] {-1}, null,
                Unit.NANOMETRE, Medium.vacuum()));
        assertThrows(IllegalArgumentException.class, () -> PeakList.of(new double[] {500}, null,
                new double[] {Double.POSITIVE_INFINITY}, Unit.NANOMETRE, Medium.vacuum()));
    }

    @Test
    void tolerancesAreReadAsPeopleWriteThem() {
        assertEquals(Tolerance.kSigma(5), Tolerance.parse("5 sigma"));
        assertEquals(Tolerance.kSigma(3), Tolerance.parse(" 3sigma "));
        assertEquals(Tolerance.Kind.ABSOLUTE, Tolerance.parse("0.02 nm").kind());
        assertEquals(2e-11, Tolerance.parse("0.02 nm").value(), 1e-26);
        assertEquals(Tolerance.relative(20 * 1e-6), Tolerance.parse("20 ppm"));
        assertEquals(Tolerance.relative(1 / 20000.0), Tolerance.parse("R=20000"));
        // Text that does not read is bad input (a RitzwerkException with a code), never an IllegalArgumentException.
        IdentificationException bad = assertThrows(IdentificationException.class, () -> Tolerance.parse("wide"));
        assertTrue(bad.getMessage().contains("'wide'") && bad.getMessage().contains("5 sigma"), bad.getMessage());
        assertEquals(IdentificationException.BAD_TOLERANCE, bad.code());
        assertTrue(assertThrows(IdentificationException.class, () -> Tolerance.parse("5 Hz")).getMessage()
                .contains("not supported"));
        assertTrue(assertThrows(IdentificationException.class, () -> Tolerance.parse("0 nm")).getMessage()
                .contains("finite and positive"));
    }

    @Test
    void candidatesRefuseAnEmptyWindowAndKeepMultipletPhysics() {
        HydrogenLikeModel model = HydrogenLikeModel.of(Scenes.PROTON, Tier.QED);
        IdentificationException none = assertThrows(IdentificationException.class,
                () -> Candidates.inWindow(1.0e-9, 1.1e-9).hydrogenLike(H, model, 5, false).build());
        assertTrue(none.getMessage().contains("no candidate line"), none.getMessage());
        assertEquals(IdentificationException.NO_CANDIDATES, none.code());
        assertThrows(IllegalArgumentException.class, () -> Candidates.inWindow(5e-7, 4e-7));
        // a hydrogen model under another ion's name entered Balmer lines as He II
        IllegalArgumentException heII = assertThrows(IllegalArgumentException.class,
                () -> Candidates.inWindow(4e-7, 7e-7).hydrogenLike(Species.parse("He II"), model, 10, false));
        assertTrue(heII.getMessage().contains("He II is not the one-electron ion of the model's nucleus (Z = 1)"),
                heII.getMessage());
        assertThrows(IllegalArgumentException.class, () -> Candidates.inWindow(4e-7, 5e-7).excitationTemperature(0));
        Candidates components = Candidates.inWindow(650e-9, 660e-9).hydrogenLike(H, model, 5, true).build();
        assertTrue(components.catalog().size() > 1, "H-alpha's fine-structure components");
        assertNull(components.multiplet(components.catalog(), 0), "components carry no multiplet physics");
        // Weighting by temperature lowers the strength of high upper levels relative to low ones.
        Candidates cold = Candidates.inWindow(370e-9, 700e-9).excitationTemperature(5000)
                .hydrogenLike(H, model, 8, false).build();
        Candidates plain = Candidates.inWindow(370e-9, 700e-9).hydrogenLike(H, model, 8, false).build();
        int last = plain.catalog().size() - 1;   // H-alpha (longest wavelength)
        double ratioCold = cold.catalog().strength(0) / cold.catalog().strength(last);
        double ratioPlain = plain.catalog().strength(0) / plain.catalog().strength(last);
        assertTrue(ratioCold < ratioPlain, ratioCold + " vs " + ratioPlain);
    }
}
