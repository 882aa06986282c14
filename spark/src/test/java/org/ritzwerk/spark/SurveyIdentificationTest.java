package org.ritzwerk.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.RowFactory;
import org.apache.spark.sql.SparkSession;
import org.apache.spark.sql.types.StructField;
import org.apache.spark.sql.types.StructType;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.convert.SpectralArrays;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.identify.Candidates;
import org.ritzwerk.engine.identify.Identification;
import org.ritzwerk.engine.identify.IdentificationException;
import org.ritzwerk.engine.identify.IdentificationSearch;
import org.ritzwerk.engine.identify.Identifier;
import org.ritzwerk.engine.identify.LineCatalog;
import org.ritzwerk.engine.identify.PeakList;
import org.ritzwerk.engine.identify.ShiftSearch;
import org.ritzwerk.engine.identify.Tolerance;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.plasma.PlasmaEstimate;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.DataLines;

/**
 * Identification on Spark (local[2]) against the library called directly on the same peak lists:
 * every number equal bit for bit (JUnit's assertEquals on doubles compares exactly), with a fixed
 * survey window and with the identify command's window per spectrum; and the refusals of bad rows.
 */
class SurveyIdentificationTest {

    private static final List<String> SPECIES = List.of("H I", "He II");
    private static final List<String> HYDROGEN = List.of("H I");

    /** The library as the identify command composes it: candidates, search, plasma estimate. */
    private static final class Library {
        final List<String> species;
        final boolean plasma;
        final DataContext data = DataContext.discoverDefault();

        final IdentificationSearch search;

        /** With the velocity search of 100 km/s. */
        Library(List<String> species, boolean plasma) {
            this(species, plasma, IdentificationSearch.of(Identifier.of(Tolerance.parse("5 sigma")))
                    .withVelocitySearch(100e3));
        }

        Library(List<String> species, boolean plasma, IdentificationSearch search) {
            this.species = species;
            this.plasma = plasma;
            this.search = search;
        }

        final PlasmaEstimate estimate = PlasmaEstimate.defaults().withInstrumentFwhm(0.05);

        /** The command's order: level-list species' Ritz lines (He I), then one-electron ions. */
        Candidates candidates(double lo, double hi) {
            Candidates.Builder builder = Candidates.inWindow(lo, hi);
            for (String s : this.species) {
                Species species = Species.parse(s);
                if (!species.isHydrogenLike()) {
                    builder.lineSet(LineSet.ofRitz(DataLines.ritzLines(data, species).withLsRules(true)
                            .compute(DataLines.levels(data, species))));
                }
            }
            for (String s : this.species) {
                Species species = Species.parse(s);
                if (species.isHydrogenLike()) {
                    builder.hydrogenLike(species, HydrogenLikeModel.of(data.nucleus(species), Tier.QED), 30, false);
                }
            }
            return builder.build();
        }
    }

    @Test
    void fixedWindowGivesTheLibrarysNumbersBitForBit() {
        fixedWindowGivesTheLibrarysNumbersBitForBit(LocalSpark.session());
    }

    /** The check of the test above in a session of any deployment ({@link SurveyClusterTest} runs it too). */
    static void fixedWindowGivesTheLibrarysNumbersBitForBit(SparkSession spark) {
        List<Fixtures.PeakListData> lists = Fixtures.peakLists(SPECIES, 12, 20, 3, 18L);
        IdentificationParameters parameters = IdentificationParameters.inWindow(SPECIES, List.of(), 360, 710)
                .withVelocitySearch(100e3);
        List<Row> rows = SurveyIdentification.of(parameters).identify(Fixtures.peakListTable(spark, lists, 3))
                .spectra().collectAsList();
        assertEquals(lists.size(), rows.size());
        Library library = new Library(SPECIES, false);
        Candidates candidates = library.candidates(360e-9, 710e-9);
        Map<String, Fixtures.PeakListData> byId = new HashMap<>();
        lists.forEach(l -> byId.put(l.id(), l));
        int matched = 0;
        int[] ambiguities = new int[2];
        for (Row row : rows) {
            Fixtures.PeakListData list = byId.get(row.getString(0));
            matched += compare(library, candidates, list, row, ambiguities);
        }
        assertTrue(matched > 12 * 15, "most peaks drawn from the lines are explained: " + matched);
        // (these lists have no close rival; the strength-weight test below has)
        assertTrue(ambiguities[0] > 0, "the reasons are compared: " + ambiguities[0] + " ambiguous");
    }

    @Test
    void windowPerSpectrumIsTheIdentifyCommandsComposition() {
        windowPerSpectrumIsTheIdentifyCommandsComposition(LocalSpark.session());
    }

    /** The check of the test above in a session of any deployment ({@link SurveyClusterTest} runs it too). */
    static void windowPerSpectrumIsTheIdentifyCommandsComposition(SparkSession spark) {
        List<Fixtures.PeakListData> lists = Fixtures.peakLists(HYDROGEN, 4, 8, 1, 19L);
        IdentificationParameters parameters = IdentificationParameters.perSpectrumWindow(HYDROGEN, List.of())
                .withVelocitySearch(100e3).withPlasmaEstimate(0.05);
        SurveyIdentification.Result result = SurveyIdentification.of(parameters)
                .identify(Fixtures.peakListTable(spark, lists, 2));
        Library library = new Library(HYDROGEN, true);
        for (Row row : result.spectra().collectAsList()) {
            Fixtures.PeakListData list = lists.stream().filter(l -> l.id().equals(row.getString(0))).findFirst()
                    .orElseThrow();
            PeakList peaks = PeakList.of(list.nm(), list.sigma(), list.photons(), Unit.NANOMETRE, Medium.vacuum());
            double[] window = library.search.candidateWindow(peaks);
            compare(library, library.candidates(window[0], window[1]), list, row);
        }
        // The per-peak table is the spectra's peaks with their spectrum's id.
        List<Row> peaks = result.peaks().collectAsList();
        assertEquals(lists.stream().mapToInt(l -> l.nm().length).sum(), peaks.size());
        assertEquals(Schemas.IDENTIFIED_PEAKS.simpleString(), result.peaks().schema().simpleString());
    }

    /**
     * The strength weight reaches the executors: a peak 2 sigma from a line and 1.3 sigma from a
     * line of the same species 100 times weaker takes the strong line at the default weight and
     * the weak one by position alone, as the command's --strength-weight does. Invented lines.
     */
    @Test
    void theStrengthWeightDecidesAsInTheLibrary(@org.junit.jupiter.api.io.TempDir java.nio.file.Path dir)
            throws java.io.IOException {
        SparkSession spark = LocalSpark.session();
        java.nio.file.Path lines = dir.resolve("two.csv");
        java.nio.file.Files.writeString(lines, "# ritzwerk-lines 1\n# id: invented-two\n# title: t\n"
                + "# source: invented\n# provenance: measured\n# version: 1\n# position-unit: nm\n# medium: vacuum\n"
                + "species,position,intensity\nKr I,500.000,100\nKr I,500.010,1\n");
        List<Fixtures.PeakListData> one = List.of(new Fixtures.PeakListData("one", new double[] {500.006},
                new double[] {0.003}, new double[] {10}, new double[] {0.01}));
        double[] taken = new double[2];
        double[] weights = {Identifier.DEFAULT_STRENGTH_WEIGHT, 0};
        for (int k = 0; k < 2; k++) {
            IdentificationParameters parameters = IdentificationParameters.perSpectrumWindow(List.of(),
                    List.of(lines.toString()));
            if (k == 1) {
                parameters = parameters.withStrengthWeight(0);
            }
            assertEquals(weights[k], parameters.strengthWeight());
            List<Row> peaks = SurveyIdentification.of(parameters).identify(Fixtures.peakListTable(spark, one, 1))
                    .peaks().collectAsList();
            assertEquals(1, peaks.size());
            taken[k] = peaks.get(0).getAs("line_position");
            // ambiguous either way, the other line its close rival: odds exp(z_other^2 / 2 - z^2 / 2 + w ln S
            // ratio), Bayes' rule with Gaussian likelihoods and the tempered strength prior (common practice)
            Row peak = peaks.get(0);
            assertEquals("close_rival", peak.getAs("ambiguity"));
            assertEquals("Kr I", peak.getAs("rival_species"));
            assertEquals(k == 0 ? 500.010 : 500.000, (double) peak.getAs("rival_position"), 1e-9);
            double zStrong = 0.006 / 0.003;
            double zWeak = 0.004 / 0.003;
            double odds = k == 0 ? Math.exp(0.5 * zWeak * zWeak + 0.5 * Math.log(100) - 0.5 * zStrong * zStrong)
                    : Math.exp(0.5 * zStrong * zStrong - 0.5 * zWeak * zWeak);
            assertEquals(odds, (double) peak.getAs("rival_odds"), 1e-6 * odds);
        }
        assertEquals(500.000, taken[0], 1e-9, "the strong line at the default weight");
        assertEquals(500.010, taken[1], 1e-9, "the nearer weak line by position alone");
        assertThrows(IllegalArgumentException.class, () -> IdentificationParameters.perSpectrumWindow(List.of("H I"),
                List.of()).withStrengthWeight(1.5));
    }

    @Test
    void offsetSearchAndARefusedSpectrumGiveTheLibrarysValues() {
        SparkSession spark = LocalSpark.session();
        List<Fixtures.PeakListData> lists = new ArrayList<>(Fixtures.peakLists(HYDROGEN, 4, 8, 1, 21L));
        // No H I line lies near 30 nm (below the Lyman limit): the library refuses this spectrum.
        lists.add(new Fixtures.PeakListData("far-uv", new double[] {30.0, 31.0}, new double[] {1e-3, 1e-3},
                new double[] {100, 200}, new double[] {0.05, 0.05}));
        IdentificationParameters parameters = IdentificationParameters.perSpectrumWindow(HYDROGEN, List.of())
                .withOffsetSearch(0.3).withPlasmaEstimate(0.05);
        Library library = new Library(HYDROGEN, true, IdentificationSearch.of(Identifier.of(Tolerance.parse(
                "5 sigma"))).withOffsetSearch(0.3e-9));
        List<Row> rows = SurveyIdentification.of(parameters).identify(Fixtures.peakListTable(spark, lists, 2))
                .spectra().collectAsList();
        assertEquals(lists.size(), rows.size());
        int refused = 0;
        for (Row row : rows) {
            Fixtures.PeakListData list = lists.stream().filter(l -> l.id().equals(row.getString(0))).findFirst()
                    .orElseThrow();
            PeakList peaks = PeakList.of(list.nm(), list.sigma(), list.photons(), Unit.NANOMETRE, Medium.vacuum());
            double[] window = library.search.candidateWindow(peaks);
            Candidates candidates;
            try {
                candidates = library.candidates(window[0], window[1]);
                library.search.run(peaks, candidates.catalog());
            } catch (IdentificationException e) {
                refused++;
                assertEquals(e.code(), row.getAs("failure_code"));
                assertEquals(e.getMessage(), row.getAs("failure"));
                for (int field = 1; field < 14; field++) {
                    assertTrue(row.isNullAt(field), "field " + field + " of a refused spectrum");
                }
                continue;
            }
            assertTrue(row.isNullAt(14), list.id());
            compare(library, candidates, list, row);
        }
        assertEquals(1, refused);
        assertEquals("far-uv", rows.stream().filter(r -> !r.isNullAt(14)).findFirst().orElseThrow().getString(0));
        assertEquals(1, refused);
    }

    /**
     * @return the explained peaks, matched or ambiguous (a random draw of lines often leaves out
     *         a species' strong lines, which makes its matches ambiguous)
     */
    private static int compare(Library library, Candidates candidates, Fixtures.PeakListData list, Row row) {
        return compare(library, candidates, list, row, new int[2]);
    }

    /**
     * As {@link #compare(Library, Candidates, Fixtures.PeakListData, Row)}, counting the peaks
     * that are ambiguous ({@code ambiguities[0]}) and those with a close rival ({@code [1]}).
     */
    private static int compare(Library library, Candidates candidates, Fixtures.PeakListData list, Row row,
            int[] ambiguities) {
        PeakList peaks = PeakList.of(list.nm(), list.sigma(), list.photons(), Unit.NANOMETRE, Medium.vacuum());
        IdentificationSearch.Report report = library.search.run(peaks, candidates.catalog());
        Identification id = report.identification();
        LineCatalog lines = report.lines();
        String where = list.id();
        assertNull(row.getAs("failure"), where);
        List<Row> peakRows = row.getList(1);
        assertEquals(list.nm().length, peakRows.size(), where);
        for (int i = 0; i < peakRows.size(); i++) {
            Row p = peakRows.get(i);
            assertEquals(i, p.getInt(0));
            assertEquals(list.nm()[i], p.getDouble(1), where);
            int j = id.line(i);
            String status = id.status(i) == Identification.MATCHED ? "matched"
                    : id.status(i) == Identification.AMBIGUOUS ? "ambiguous" : "unexplained";
            assertEquals(status, p.getString(2), where + " peak " + i);
            // why it is ambiguous, and its close rival, as the library says
            java.util.Set<Identification.Ambiguity> why = id.ambiguity(i);
            String reasons = String.join(";", why.stream().map(Identification.Ambiguity::id).toList());
            assertEquals(why.isEmpty() ? null : reasons, p.getAs("ambiguity"), where + " peak " + i);
            ambiguities[0] += why.isEmpty() ? 0 : 1;
            int rival = id.rival(i);
            if (rival < 0) {
                assertTrue(p.isNullAt(9) && p.isNullAt(10) && p.isNullAt(11) && p.isNullAt(12), where + " peak " + i);
            } else {
                ambiguities[1]++;
                double[] at = new double[1];
                SpectralArrays.convert(new double[] {id.rivalPosition(i)}, Unit.METRE, Medium.vacuum(),
                        Unit.NANOMETRE, Medium.vacuum(), at);
                assertEquals(lines.species(rival).notation(), p.getAs("rival_species"));
                assertEquals(lines.label(rival), p.getAs("rival_line"));
                assertEquals(at[0], p.getDouble(11), where + " peak " + i);
                assertEquals(id.rivalOdds(i), p.getDouble(12), where + " peak " + i);
            }
            if (j < 0) {
                assertTrue(p.isNullAt(3) && p.isNullAt(5) && p.isNullAt(7), where + " peak " + i);
                continue;
            }
            double[] line = new double[1];
            SpectralArrays.convert(new double[] {id.matchedPosition(i)}, Unit.METRE, Medium.vacuum(),
                    Unit.NANOMETRE, Medium.vacuum(), line);
            assertEquals(lines.species(j).notation(), p.getString(3));
            assertEquals(lines.label(j), p.getString(4));
            assertEquals(line[0], p.getDouble(5), where + " peak " + i);
            assertEquals(list.nm()[i] - line[0], p.getDouble(6));
            assertEquals(id.normalizedResidual(i), p.getDouble(7));
        }
        assertEquals(id.count(Identification.MATCHED), row.getInt(2));
        assertEquals(id.count(Identification.AMBIGUOUS), row.getInt(3));
        assertEquals(id.count(Identification.UNEXPLAINED), row.getInt(4));
        ShiftSearch.Fit v = report.velocity().orElse(null);
        if (v == null) {
            assertTrue(row.isNullAt(5) && row.isNullAt(6) && row.isNullAt(7), "no velocity searched");
        } else {
            assertEquals(v.velocity(), row.getDouble(5), where);
            assertEquals(v.velocityUncertainty(), row.getDouble(6), where);
            assertEquals(v.matches(), row.getInt(7));
        }
        ShiftSearch.Fit o = report.offset().orElse(null);
        if (o == null) {
            assertTrue(row.isNullAt(8) && row.isNullAt(9) && row.isNullAt(10), "no offset searched");
        } else {
            assertTrue(o.matches() >= 2, where + ": the test needs an offset fit of several lines");
            assertEquals(o.value() * 1e9, row.getDouble(8), where);
            assertEquals(o.uncertainty() * 1e9, row.getDouble(9), where);
            assertEquals(o.matches(), row.getInt(10));
        }
        List<String> missing = new ArrayList<>();
        for (int j : id.missingStrongLines()) {
            missing.add(lines.species(j).notation() + " " + lines.label(j));
        }
        assertEquals(missing, row.getList(11));
        List<Row> presence = row.getList(12);
        assertEquals(id.shiftsTried(), row.getDouble(row.fieldIndex("shifts_tried")));
        List<Identification.SpeciesPresence> expected = id.speciesPresence();
        assertEquals(expected.size(), presence.size());
        for (int k = 0; k < expected.size(); k++) {
            Identification.SpeciesPresence e = expected.get(k);
            Row r = presence.get(k);
            assertEquals(e.species().notation(), r.getString(0));
            assertEquals(e.matched(), r.getInt(1));
            assertEquals(e.matchedByChance(), r.getDouble(2));
            assertEquals(e.strongInRange(), r.getInt(3));
            assertEquals(e.strongMatched(), r.getInt(4));
            assertEquals(e.strongByChance(), r.getDouble(5));
            assertEquals(e.chanceProbability(), r.isNullAt(6) ? Double.NaN : r.getDouble(6));
            assertEquals(e.presence(), r.isNullAt(7) ? Double.NaN : r.getDouble(7));
        }
        if (!library.plasma) {
            assertTrue(row.isNullAt(13), "no plasma estimate asked for");
            return id.count(Identification.MATCHED) + id.count(Identification.AMBIGUOUS);
        }
        List<PlasmaEstimate.Row> plasma = library.estimate.estimate(new PlasmaEstimate.Peaks(list.nm(), Unit.NANOMETRE,
                Medium.vacuum(), list.photons(), list.width()), id, lines, candidates);
        List<Row> plasmaRows = row.getList(13);
        assertEquals(plasma.size(), plasmaRows.size(), where);
        for (int k = 0; k < plasma.size(); k++) {
            PlasmaEstimate.Row e = plasma.get(k);
            Row r = plasmaRows.get(k);
            assertEquals(e.species().notation(), r.getString(0));
            assertEquals(e.quantity().id(), r.getString(1));
            assertEquals(e.value().isPresent() ? e.value().getAsDouble() : Double.NaN,
                    r.isNullAt(2) ? Double.NaN : r.getDouble(2));
            assertEquals(e.uncertainty().isPresent() ? e.uncertainty().getAsDouble() : Double.NaN,
                    r.isNullAt(3) ? Double.NaN : r.getDouble(3));
            assertEquals(e.quantity().unit(), r.getString(4));
            assertEquals(e.lines(), r.getString(5));
            assertEquals(e.note(), r.getString(6));
        }
        return id.count(Identification.MATCHED) + id.count(Identification.AMBIGUOUS);
    }

    /**
     * He I from its level list is a species on Spark as in the identify command: peaks at the
     * vacuum Ritz wavelengths of He I lines with A (and H I's) give the library's identification
     * with the command's candidates, level-list lines first.
     */
    @Test
    void heliumFromItsLevelListIsIdentifiedAsByTheCommand() {
        SparkSession spark = LocalSpark.session();
        List<String> species = List.of("He I", "H I");
        Library library = new Library(species, false, IdentificationSearch.of(Identifier.of(Tolerance.parse(
                "5 sigma"))));
        LineCatalog lines = library.candidates(380e-9, 700e-9).catalog();
        List<Fixtures.PeakListData> lists = new ArrayList<>();
        for (int k = 0; k < 3; k++) {
            List<Double> nm = new ArrayList<>();
            for (int j = k; j < lines.size(); j += 3) {
                if (lines.species(j).equals(Species.parse("He I")) || j % 5 == 0) {
                    nm.add(lines.wavelength(j) * 1e9 + 2e-4 * ((j % 7) - 3) / 3.0);
                }
            }
            double[] positions = nm.stream().mapToDouble(Double::doubleValue).sorted().toArray();
            double[] sigma = new double[positions.length];
            double[] photons = new double[positions.length];
            double[] width = new double[positions.length];
            Arrays.fill(sigma, 2e-4);
            Arrays.fill(photons, 100);
            Arrays.fill(width, 0.05);
            lists.add(new Fixtures.PeakListData("he-" + k, positions, sigma, photons, width));
        }
        List<Row> rows = SurveyIdentification.of(IdentificationParameters.perSpectrumWindow(species, List.of()))
                .identify(Fixtures.peakListTable(spark, lists, 2)).spectra().collectAsList();
        int helium = 0;
        for (Row row : rows) {
            Fixtures.PeakListData list = lists.stream().filter(l -> l.id().equals(row.getString(0))).findFirst()
                    .orElseThrow();
            PeakList peaks = PeakList.of(list.nm(), list.sigma(), list.photons(), Unit.NANOMETRE, Medium.vacuum());
            double[] window = library.search.candidateWindow(peaks);
            compare(library, library.candidates(window[0], window[1]), list, row);
            for (Row p : row.<Row>getList(1)) {
                helium += "He I".equals(p.getString(3)) ? 1 : 0;
            }
        }
        assertTrue(helium > 20, "He I peaks identified: " + helium);
    }

    /**
     * Peaks in cm-1: the residual (position minus line, in cm-1) and residual_sigma share one sign,
     * the opposite of the wavelength's normalised residual, as the identify command prints them
     * (they had opposite signs on Spark).
     */
    @Test
    void aResidualInWavenumbersAndItsSigmaShareOneSign() {
        SparkSession spark = LocalSpark.session();
        List<Fixtures.PeakListData> lists = new ArrayList<>();
        for (Fixtures.PeakListData list : Fixtures.peakLists(HYDROGEN, 4, 10, 1, 23L)) {
            int n = list.nm().length;
            double[] k = new double[n];
            double[] sigma = new double[n];
            for (int i = 0; i < n; i++) {
                k[i] = 1e7 / list.nm()[i];
                sigma[i] = list.sigma()[i] * 1e7 / (list.nm()[i] * list.nm()[i]);
            }
            lists.add(new Fixtures.PeakListData(list.id(), k, sigma, list.photons(), list.width()));
        }
        Unit perCm = Unit.fromSymbol("cm-1").orElseThrow();
        List<Row> rows = SurveyIdentification.of(IdentificationParameters.perSpectrumWindow(HYDROGEN, List.of())
                .withUnit("cm-1", "vacuum").withVelocitySearch(100e3)).identify(Fixtures.peakListTable(spark, lists, 2))
                .spectra().collectAsList();
        Library library = new Library(HYDROGEN, false);
        int matched = 0;
        for (Row row : rows) {
            Fixtures.PeakListData list = lists.stream().filter(l -> l.id().equals(row.getString(0))).findFirst()
                    .orElseThrow();
            PeakList peaks = PeakList.of(list.nm(), list.sigma(), list.photons(), perCm, Medium.vacuum());
            double[] window = library.search.candidateWindow(peaks);
            Identification id = library.search.run(peaks, library.candidates(window[0], window[1]).catalog())
                    .identification();
            assertNull(row.getAs("failure"), list.id());
            List<Row> peakRows = row.getList(1);
            for (int i = 0; i < peakRows.size(); i++) {
                Row p = peakRows.get(i);
                if (p.isNullAt(7)) {
                    continue;
                }
                matched++;
                assertEquals(id.normalizedResidual(i, perCm), p.getDouble(7), list.id() + " peak " + i);
                assertEquals(-id.normalizedResidual(i), p.getDouble(7));
                assertTrue(Math.signum(p.getDouble(6)) == Math.signum(p.getDouble(7)) || p.getDouble(6) == 0,
                        list.id() + " peak " + i + ": residual " + p.getDouble(6) + ", sigma " + p.getDouble(7));
            }
        }
        assertTrue(matched >= 4 * 8, "matched peaks: " + matched);
    }

    @Test
    void onePeakPerRowGroupsIntoTheSamePeakLists() {
        SparkSession spark = LocalSpark.session();
        List<Fixtures.PeakListData> lists = Fixtures.peakLists(SPECIES, 3, 6, 1, 20L);
        List<Row> perPeak = new ArrayList<>();
        for (Fixtures.PeakListData list : lists) {
            for (int i = list.nm().length - 1; i >= 0; i--) { // out of order on purpose
                perPeak.add(RowFactory.create(list.id(), i, list.nm()[i], list.sigma()[i], list.photons()[i],
                        i == 0 && list.id().equals("spectrum-1") ? null : list.width()[i]));
            }
        }
        Dataset<Row> grouped = SurveyIdentification.peakLists(spark.createDataFrame(perPeak, Schemas.PEAK_ROWS));
        for (Row row : grouped.collectAsList()) {
            Fixtures.PeakListData list = lists.stream().filter(l -> l.id().equals(row.getString(0))).findFirst()
                    .orElseThrow();
            assertEquals(toList(list.nm()), row.getList(1));
            assertEquals(toList(list.sigma()), row.getList(2));
            assertEquals(toList(list.photons()), row.getList(3));
            if (list.id().equals("spectrum-1")) {
                assertTrue(row.isNullAt(4), "one peak without a width: the spectrum has no widths");
            } else {
                assertEquals(toList(list.width()), row.getList(4));
            }
        }
    }

    @Test
    void aRepeatedPeakOfOneSpectrumFailsTheJobNamingTheIdAndPeak() {
        SparkSession spark = LocalSpark.session();
        List<Row> perPeak = new ArrayList<>();
        // The same indices in two spectra are fine; spectrum "b" gives peak 1 three times (once as
        // an exact copy of another row).
        for (String id : List.of("a", "b")) {
            for (int i = 0; i < 3; i++) {
                perPeak.add(RowFactory.create(id, i, 486.1 + i, 1e-3, null, null));
            }
        }
        perPeak.add(RowFactory.create("b", 1, 600.0, 1e-3, null, null));
        perPeak.add(RowFactory.create("b", 1, 487.1, 1e-3, null, null));
        Dataset<Row> grouped = SurveyIdentification.peakLists(spark.createDataFrame(perPeak, Schemas.PEAK_ROWS));
        String message = failure(() -> grouped.collectAsList());
        assertEquals("row 'b', field 'peak': peak 1 is given by 3 rows of this spectrum; each peak of a spectrum"
                + " needs its own index (the arrays are ordered by it)", message);
        SurveyIdentification job = SurveyIdentification.of(IdentificationParameters.inWindow(SPECIES, List.of(), 360,
                710));
        message = failure(() -> job.identify(grouped).spectra().count());
        assertTrue(message.startsWith("row 'b', field 'peak': peak 1 is given by 3 rows"), message);

        List<Row> nullPeak = List.of(RowFactory.create("c", 0, 486.1, 1e-3, null, null),
                RowFactory.create("c", null, 487.1, 1e-3, null, null));
        message = failure(() -> SurveyIdentification.peakLists(spark.createDataFrame(nullPeak,
                NULLABLE_PEAK_ROWS)).collectAsList());
        assertTrue(message.startsWith("row 'c', field 'peak': is null"), message);

        // Without repeats the same rows group (the check passes every spectrum).
        List<Row> unique = perPeak.subList(0, 6);
        assertEquals(2, SurveyIdentification.peakLists(spark.createDataFrame(unique, Schemas.PEAK_ROWS))
                .collectAsList().size());

        // A gap: peaks 0 and 5 would come out as 0 and 1, so no identified peak could be joined back.
        List<Row> gap = List.of(RowFactory.create("d", 0, 486.1, 1e-3, null, null),
                RowFactory.create("d", 5, 487.1, 1e-3, null, null));
        message = failure(() -> SurveyIdentification.peakLists(spark.createDataFrame(gap, Schemas.PEAK_ROWS))
                .collectAsList());
        assertTrue(message.startsWith("row 'd', field 'peak': the peaks of a spectrum must be numbered 0, 1, 2, ..."
                + " without a gap, so that the identified peaks carry the same numbers; after peak 0 comes peak 5"),
                message);
    }

    /**
     * Grouping peak rows checks each row as identify checks a peak list (positions finite and
     * above 0; sigmas, intensities and widths finite and at least 0 where given) and names the
     * spectrum, the column, the peak and the value; until 2026-12-05 such rows were grouped
     * silently, and a negative sigma, intensity or width reached identify only as an element of
     * an array.
     */
    @Test
    void aMalformedPeakRowFailsTheGroupingNamingItsSpectrumColumnAndValue() {
        SparkSession spark = LocalSpark.session();
        Object[][] cases = {
            {"e", 1, Double.NaN, 1e-3, null, null, "row 'e', field 'position': peak 1 has NaN; a position must be"
                    + " finite and above 0"},
            {"e", 1, 0.0, 1e-3, null, null, "row 'e', field 'position': peak 1 has 0.0; a position must be finite"
                    + " and above 0"},
            {"e", 1, null, 1e-3, null, null, "row 'e', field 'position': peak 1 has none; each peak needs a"
                    + " position"},
            {"e", 1, 487.1, Double.POSITIVE_INFINITY, null, null, "row 'e', field 'sigma': peak 1 has Infinity; a"
                    + " sigma must be finite and at least 0"},
            {"e", 1, 487.1, -1e-3, null, null, "row 'e', field 'sigma': peak 1 has -0.001; a sigma must be finite"
                    + " and at least 0"},
            {"e", 1, 487.1, 1e-3, -2.0, null, "row 'e', field 'intensity': peak 1 has -2.0; an intensity must be"
                    + " finite and at least 0"},
            {"e", 1, 487.1, 1e-3, null, Double.NaN, "row 'e', field 'width': peak 1 has NaN; a width must be finite"
                    + " and at least 0"},
            {null, 1, 487.1, 1e-3, null, null, "field 'id': a peak row's id is null (peak 1, position 487.1); each"
                    + " peak row needs the id of its spectrum"}};
        // Each row's check, as Spark calls it for every peak row entering the grouping.
        for (Object[] bad : cases) {
            SparkRowException e = assertThrows(SparkRowException.class, () -> new SurveyIdentification.PeakRowCheck()
                    .call((String) bad[0], (Integer) bad[1], (Double) bad[2], (Double) bad[3], (Double) bad[4],
                            (Double) bad[5]));
            assertEquals(bad[6], e.getMessage());
            assertEquals(SparkRowException.BAD_FIELD, e.code());
            assertEquals(bad[0], e.rowId());
        }
        // And in a job: the first and last cases fail the grouping with the same message (one job each).
        for (Object[] bad : new Object[][] {cases[0], cases[cases.length - 1]}) {
            List<Row> rows = List.of(RowFactory.create("e", 0, 486.1, 1e-3, 5.0, 0.01),
                    RowFactory.create(bad[0], bad[1], bad[2], bad[3], bad[4], bad[5]),
                    RowFactory.create("f", 0, 486.1, 1e-3, 5.0, 0.01));
            String message = failure(() -> SurveyIdentification.peakLists(spark.createDataFrame(rows,
                    NULLABLE_PEAK_ROWS)).collectAsList());
            assertEquals(bad[6], message);
        }
        // A sigma, intensity and width of 0 are allowed (as in a peak list), and so are two peaks at one position.
        List<Row> edge = List.of(RowFactory.create("g", 0, 486.1, 0.0, 0.0, 0.0),
                RowFactory.create("g", 1, 486.1, 0.0, 0.0, 0.0));
        Row grouped = SurveyIdentification.peakLists(spark.createDataFrame(edge, Schemas.PEAK_ROWS)).collectAsList()
                .get(0);
        assertEquals(List.of(486.1, 486.1), grouped.getList(1));
        assertEquals(List.of(0.0, 0.0), grouped.getList(2));
    }

    /** The per-peak schema with a nullable peak column, as a table read from files may have it. */
    private static final StructType NULLABLE_PEAK_ROWS = new StructType(Arrays.stream(Schemas.PEAK_ROWS.fields())
            .map(f -> new StructField(f.name(), f.dataType(), true, f.metadata())).toArray(StructField[]::new));

    private static List<Double> toList(double[] values) {
        List<Double> list = new ArrayList<>();
        for (double v : values) {
            list.add(v);
        }
        return list;
    }

    @Test
    void aMalformedRowFailsTheJobNamingItsIdAndField() {
        SparkSession spark = LocalSpark.session();
        SurveyIdentification job = SurveyIdentification.of(IdentificationParameters.inWindow(SPECIES, List.of(), 360,
                710));
        List<Row> rows = new ArrayList<>();
        rows.add(RowFactory.create("good", new double[] {486.1, 656.4}, new double[] {1e-3, 1e-3}, null, null));
        rows.add(RowFactory.create("bad", new double[] {486.1, Double.NaN}, new double[] {1e-3, 1e-3}, null, null));
        String message = failure(() -> job.identify(spark.createDataFrame(rows, Schemas.PEAK_LISTS)).spectra()
                .collectAsList());
        assertTrue(message.contains("row 'bad', field 'positions': element 1 is NaN"), message);

        List<Row> unequal = List.of(RowFactory.create("short", new double[] {486.1, 656.4}, new double[] {1e-3},
                null, null));
        message = failure(() -> job.identify(spark.createDataFrame(unequal, Schemas.PEAK_LISTS)).spectra().count());
        assertTrue(message.contains("row 'short', field 'sigmas': has 1 elements, but positions has 2"), message);

        List<Row> noSigmas = List.of(RowFactory.create("plain", new double[] {486.1}, null, null, null));
        message = failure(() -> job.identify(spark.createDataFrame(noSigmas, Schemas.PEAK_LISTS)).spectra().count());
        assertTrue(message.contains("row 'plain', field 'sigmas': is null, but the tolerance '5 sigma'"), message);

        // A table without the positions column is refused on the driver, before any task.
        SparkRowException schema = assertThrows(SparkRowException.class, () -> job.identify(
                spark.createDataFrame(rows, Schemas.PEAK_LISTS).drop("positions")));
        assertEquals(SparkRowException.BAD_SCHEMA, schema.code());
        assertTrue(schema.getMessage().startsWith("field 'positions': the peak-list table has no such column"),
                schema.getMessage());
        // Whole numbers, as JSON reads them, are refused with the cast that fixes them.
        Dataset<Row> whole = spark.createDataFrame(rows, Schemas.PEAK_LISTS).withColumn("positions",
                org.apache.spark.sql.functions.col("positions").cast("array<bigint>"));
        schema = assertThrows(SparkRowException.class, () -> job.identify(whole));
        assertEquals("field 'positions': the peak-list table has it as array<bigint>, not array<double> (JSON and"
                + " CSV readers choose their own number types: cast it, col(\"positions\").cast(\"array<double>\"))",
                schema.getMessage());
    }

    /** @return the message of the SparkRowException that failed the job */
    static String failure(Runnable job) {
        Throwable thrown = assertThrows(Exception.class, job::run);
        for (Throwable t = thrown; t != null; t = t.getCause()) {
            if (t instanceof SparkRowException) {
                return t.getMessage();
            }
        }
        return String.valueOf(thrown.getMessage());
    }
}
