package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.identify.Candidates;
import org.ritzwerk.engine.identify.Identification;
import org.ritzwerk.engine.identify.IdentificationSearch;
import org.ritzwerk.engine.identify.Identifier;
import org.ritzwerk.engine.identify.PeakList;
import org.ritzwerk.engine.identify.Tolerance;
import org.ritzwerk.engine.plasma.PlasmaEstimate;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;

/**
 * The README's identification example, compiled and run: Balmer peaks in air from a source
 * receding at an invented 35 km/s, with photon counts of a Boltzmann population at an invented
 * 11,000 K, identified with a velocity search; the plasma estimate gives the temperature back.
 */
class IdentificationGuideTest {

    @Test
    void identifyWithAVelocitySearchAndThePlasmaEstimate() {
        DataContext data = DataContext.builtIn();
        HydrogenLikeModel hydrogen = HydrogenLikeModel.of(data.nucleus(Species.parse("H I")),
                Tier.QED);
        // The invented observation, made from the engine's own multiplets.
        Candidates truth = Candidates.inWindow(380e-9, 700e-9).hydrogenLike(Species.parse("H I"), hydrogen, 10, false)
                .build();
        int n = truth.catalog().size();
        double[] positionsNm = new double[n];
        double[] sigmasNm = new double[n];
        double[] intensities = new double[n];
        double[] fwhmNm = new double[n];
        for (int j = 0; j < n; j++) {
            double moved = truth.catalog().wavelength(j) * (1 + 35e3 / PhysicalConstants.C);
            positionsNm[j] = Medium.air().fromVacuum(moved) * 1e9;
            sigmasNm[j] = 3e-4;
            Candidates.Multiplet m = truth.multiplet(truth.catalog(), j);
            intensities[j] = m.weight() * m.einsteinA() * Math.exp(-m.upperEnergy() / (PhysicalConstants.K * 11_000));
            fwhmNm[j] = Double.NaN;
        }

        // --- README: identification ---
        PeakList peaks = PeakList.of(positionsNm, sigmasNm, intensities, Unit.NANOMETRE, Medium.air());
        IdentificationSearch search = IdentificationSearch.of(Identifier.of(Tolerance.parse("5 sigma")))
                .withVelocitySearch(300e3);                                  // m/s; or withOffsetSearch(metres)
        double[] window = search.candidateWindow(peaks);                     // vacuum metres
        Candidates candidates = Candidates.inWindow(window[0], window[1])
                .hydrogenLike(Species.parse("H I"), hydrogen, 30, false)    // n -> n' multiplets, strength g A
                .lineList(data.lampLines(Species.parse("Ne I")))        // and any line list
                .build();
        IdentificationSearch.Report report = search.run(peaks, candidates.catalog());
        Identification result = report.identification();
        result.line(0); result.status(0); result.residual(0); result.missingStrongLines(); result.speciesPresence();
        double velocity = report.velocity().orElseThrow().velocity();        // m/s
        List<PlasmaEstimate.Row> plasma = PlasmaEstimate.defaults().withResolvingPower(5000)
                .estimate(new PlasmaEstimate.Peaks(positionsNm, Unit.NANOMETRE, Medium.air(), intensities, fwhmNm),
                        result, report.lines(), candidates);                // Boltzmann-plot T, Stark n_e
        // --- end ---

        assertEquals(35e3, velocity, 50);
        assertEquals(n, result.count(Identification.MATCHED));
        assertEquals(11_000, plasma.get(0).value().orElseThrow(), 1);
        assertTrue(plasma.stream().skip(1).allMatch(r -> r.value().isEmpty()), "no widths given, no density");
    }
}
