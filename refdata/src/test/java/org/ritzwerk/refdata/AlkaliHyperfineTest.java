package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.math.BigDecimal;
import java.math.MathContext;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.MeasuredLevel;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.engine.hyperfine.HyperfineComponent;
import org.ritzwerk.engine.hyperfine.HyperfineConstants;
import org.ritzwerk.engine.hyperfine.HyperfineStructure;
import org.ritzwerk.engine.hyperfine.ZeemanComponent;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.refdata.internal.RydbergData;

/**
 * The isotope-specific D lines and hyperfine constants, read through the data context and the
 * engine, against the published values named beside each check.
 */
class AlkaliHyperfineTest {

    private static final DataContext CONTEXT = DataContext.builtIn();

    /** Published D1 and D2 centroids, MHz, with their source (the digits as the paper prints them). */
    private record Published(String species, String line, String megahertz, String source) {
    }

    private static final List<Published> D_LINES = List.of(
            new Published("Li-6 I", "D1", "446789596.091", "Sansonetti et al., Phys. Rev. Lett. 107, 023001 (2011), from memory"),
            new Published("Li-6 I", "D2", "446799650.653", "Sansonetti et al. 2011, from memory"),
            new Published("Li-7 I", "D1", "446800129.853", "Sansonetti et al. 2011, from memory"),
            new Published("Li-7 I", "D2", "446810184.329", "Sansonetti et al. 2011, from memory"),
            new Published("Na-23 I", "D1", "508333195.7", "NIST ASD Na I 3p 2P1/2 16956.17025 cm-1 (from memory) times c"),
            new Published("Na-23 I", "D2", "508848716.2", "Juncar et al., Metrologia 17, 77 (1981), from memory"),
            new Published("K-39 I", "D1", "389286058.716", "Falke et al., Phys. Rev. A 74, 032503 (2006), from memory"),
            new Published("K-39 I", "D2", "391016170.03", "Falke et al. 2006, from memory"),
            new Published("K-40 I", "D1", "389286184.353", "Falke et al. 2006, from memory"),
            new Published("K-40 I", "D2", "391016296.050", "Falke et al. 2006, from memory"),
            new Published("K-41 I", "D1", "389286294.205", "Falke et al. 2006, from memory"),
            new Published("K-41 I", "D2", "391016406.21", "Falke et al. 2006, from memory"),
            new Published("Rb-85 I", "D1", "377107385.690", "Banerjee, Das and Natarajan, Europhys. Lett. 65, 172 (2004), from memory"),
            new Published("Rb-85 I", "D2", "384230406.373", "Barwood, Gill and Rowley, Appl. Phys. B 53, 142 (1991), from memory"),
            new Published("Rb-87 I", "D1", "377107463.380", "Maric, McFerran and Luiten, Phys. Rev. A 77, 032502 (2008), from memory"),
            new Published("Rb-87 I", "D2", "384230484.4685", "Ye, Swartz, Jungner and Hall, Opt. Lett. 21, 1280 (1996), from memory"),
            new Published("Cs-133 I", "D1", "335116048.7481", "Gerginov et al., Phys. Rev. A 73, 032504 (2006), read in its abstract"),
            new Published("Cs-133 I", "D2", "351725718.4744", "Gerginov et al., Phys. Rev. A 70, 042505 (2004), from memory"));

    @Test
    void dLineCentroidsOfEveryIsotopeThroughTheEngineWithin1MHz() {
        for (Published p : D_LINES) {
            Species species = Species.parse(p.species());
            AlkaliAtom atom = CONTEXT.alkaliAtom(species);
            State upper = State.of(atom.groundState().n(), 1, p.line().equals("D1") ? 1 : 3);
            double hz = atom.frequencyHz(atom.groundState(), upper);
            assertEquals(Double.parseDouble(p.megahertz()) * 1e6, hz, 1e6, p.species() + " " + p.line() + " (" + p.source() + ")");
            // and the compatibility path
            double old = RydbergData.builtIn().atom(species).frequencyHz(atom.groundState(), upper);
            assertEquals(hz, old, 0.0, p.species() + " " + p.line());
        }
    }

    @Test
    void guardTheDLinesKeepTheUnitAndDigitsOfTheirSource() {
        // the stored text is the published digits in the published unit (never eV), and the level the
        // engine gets is that number divided by c in exact decimal arithmetic
        Map<String, String[]> stored = Map.of(
                "Cs-133 I D1", new String[] {"335116048748.1", "2.4", "kHz"},
                "Cs-133 I D2", new String[] {"351725718.4744", "0.0051", "MHz"},
                "Rb-87 I D2", new String[] {"384230484.4685", "0.0062", "MHz"},
                "Rb-87 I D1", new String[] {"377107463.380", "0.011", "MHz"},
                "Na-23 I D1", new String[] {"16956.17025", "0.000005", "cm-1"},
                "K-40 I D2", new String[] {"391016296.050", "0.088", "MHz"});
        List<AlkaliHyperfine.DLine> lines = CONTEXT.alkaliHyperfine().dLines();
        assertEquals(18, lines.size());
        for (AlkaliHyperfine.DLine d : lines) {
            assertTrue(AlkaliHyperfine.D_LINE_UNITS.contains(d.unit()), d.unit());
            assertFalse(d.unit().contains("eV"));
            String[] expected = stored.get(d.species().notation() + " " + d.line());
            if (expected != null) {
                assertEquals(expected[0], d.frequencyText(), d.species() + " " + d.line());
                assertEquals(expected[1], d.uncertaintyText(), d.species() + " " + d.line());
                assertEquals(expected[2], d.unit(), d.species() + " " + d.line());
            }
            BigDecimal perCm = switch (d.unit()) {
                case "MHz" -> new BigDecimal(d.frequencyText()).divide(new BigDecimal("29979.2458"), MathContext.DECIMAL128);
                case "kHz" -> new BigDecimal(d.frequencyText()).divide(new BigDecimal("29979245.8"), MathContext.DECIMAL128);
                default -> new BigDecimal(d.frequencyText());
            };
            List<MeasuredLevel> levels = CONTEXT.alkaliAtom(d.species()).measuredLevels();
            MeasuredLevel level = levels.stream().filter(m -> m.state().l() == 1 && m.state().twoJ() == d.twoJUpper())
                    .min((a, b) -> Double.compare(a.energyPerCm(), b.energyPerCm())).orElseThrow();
            assertEquals(perCm.doubleValue(), level.energyPerCm(), 0.0, d.species() + " " + d.line());
            assertTrue(level.source().contains(d.frequencyText()), level.source());
        }
    }

    /** Published hyperfine splittings, MHz: (species, level, F-interval index from the top, value, source). */
    @Test
    void groundAndFirstPHyperfineSplittingsWithin100kHz() {
        Object[][] ground = {
            {"Li-6 I", 228.2052590, "Arimondo, Inguscio and Violino, Rev. Mod. Phys. 49, 31 (1977), from memory"},
            {"Li-7 I", 803.5040866, "Arimondo et al. 1977, from memory"},
            {"Na-23 I", 1771.6261288, "Arimondo et al. 1977, from memory"},
            {"K-39 I", 461.7197202, "Arimondo et al. 1977, from memory"},
            {"K-40 I", -1285.7907, "Arimondo et al. 1977, from memory (inverted: F = 9/2 lies below F = 7/2)"},
            {"K-41 I", 254.0138720, "Arimondo et al. 1977, from memory"},
            {"Rb-85 I", 3035.7324390, "Arimondo et al. 1977, from memory"},
            {"Rb-87 I", 6834.68261090429, "Bize et al., Europhys. Lett. 45, 558 (1999), from memory"},
            {"Cs-133 I", 9192.631770, "the SI definition of the second (exact)"}};
        for (Object[] g : ground) {
            Species species = Species.parse((String) g[0]);
            AlkaliAtom atom = CONTEXT.alkaliAtom(species);
            double split = HyperfineStructure.splittingHertz(CONTEXT.nucleus(species).twiceSpin(), 1,
                    CONTEXT.alkaliHyperfine().constants(species, atom.groundState()).orElseThrow().constants());
            assertEquals((double) g[1] * 1e6, split, 1e5, g[0] + " ground (" + g[2] + ")");
        }
        assertEquals(9192631770.0, groundSplitting("Cs-133 I"), 1e-3, "Cs-133: exact by the SI second");
        assertEquals(6834682610.904, groundSplitting("Rb-87 I"), 0.01, "Bize et al. 1999");
        // first p levels: intervals between neighbouring F, from the top (MHz)
        check("Cs-133 I", "6p1/2", new double[] {1167.7236}, "Gerginov et al. 2006, read in its abstract");
        check("Cs-133 I", "6p3/2", new double[] {251.0916, 201.2871, 151.2247},
                "Gerginov, Derevianko and Tanner, Phys. Rev. Lett. 91, 072501 (2003), from memory");
        check("Rb-87 I", "5p1/2", new double[] {816.656}, "Barwood et al. 1991 (A = 408.328 MHz), from memory");
        check("Rb-87 I", "5p3/2", new double[] {266.650, 156.947, 72.218}, "Ye et al. 1996, from memory");
        check("Rb-85 I", "5p3/2", new double[] {120.640, 63.401, 29.372}, "Barwood et al. 1991, from memory");
        check("Na-23 I", "3p3/2", new double[] {58.326, 34.344, 15.810}, "Yei, Sieradzan and Havey 1993, from memory");
        check("Li-6 I", "2p1/2", new double[] {26.108}, "Y.-C. Huang, PhD thesis, NTHU (2018), read in its abstract");
        check("Li-7 I", "2p1/2", new double[] {91.873}, "Y.-C. Huang, PhD thesis, NTHU (2018), read in its abstract");
    }

    @Test
    void caesiumSevenPTakesItsMeasuredConstantsNotTheScaledSeries() {
        Species cs = Species.parse("Cs-133 I");
        // 7p1/2: A = 94.38(6) MHz (Compact 459 nm Cs cell optical frequency standard, arXiv:2206.09409, read in the
        // abstract); 7p3/2: A = 16.605(6) MHz, B = -0.15(3) MHz (Arimondo, Inguscio and Violino 1977, from memory)
        HyperfineConstants p12 = CONTEXT.hyperfineConstants(cs, State.parse("7p1/2")).orElseThrow();
        HyperfineConstants p32 = CONTEXT.hyperfineConstants(cs, State.parse("7p3/2")).orElseThrow();
        assertEquals(94.38e6, p12.aHertz(), 1e-3);
        assertEquals(16.605e6, p32.aHertz(), 1e-3);
        assertEquals(-0.15e6, p32.bHertz(), 1e-3);
        assertTrue(p12.source().contains("arXiv:2206.09409") && !p12.source().contains("n*^-3"), p12.source());
        assertTrue(p32.source().contains("Rev. Mod. Phys. 49") && !p32.source().contains("n*^-3"), p32.source());
        // a from-memory 7p row is not attributed to a D-line compilation, which tabulates no 7p constants
        var row = CONTEXT.alkaliHyperfine().constants(cs, State.parse("7p3/2")).orElseThrow();
        assertEquals(Provenance.Kind.FROM_MEMORY, row.provenance());
        assertFalse(row.source().contains("Steck"), row.source());
        // the scaled series still serves 8p: A n*^-3 of Song et al. 2024's 3.760 GHz (read in the abstract)
        HyperfineConstants p8 = CONTEXT.hyperfineConstants(cs, State.parse("8p1/2")).orElseThrow();
        double nStar = CONTEXT.alkaliAtom(cs).level(State.parse("8p1/2")).effectiveN();
        assertEquals(3760e6 / Math.pow(nStar, 3), p8.aHertz(), 1e-3 * p8.aHertz());
        // the 7p3/2 F' = 5 - 4 interval: 5A + (5/7)B = 82.918 MHz (Casimir formula with I = 7/2, J = 3/2)
        var f = CONTEXT.hyperfineLevels(cs, State.parse("7p3/2"));
        double hz = (f.get(3).energyPerCm() - f.get(2).energyPerCm()) * PhysicalConstants.C * 100;
        assertEquals(5 * 16.605e6 + 5.0 / 7 * -0.15e6, hz, 1e3);
    }

    private static double groundSplitting(String name) {
        Species species = Species.parse(name);
        return HyperfineStructure.splittingHertz(CONTEXT.nucleus(species).twiceSpin(), 1, CONTEXT.alkaliHyperfine()
                .constants(species, CONTEXT.alkaliAtom(species).groundState()).orElseThrow().constants());
    }

    private static void check(String name, String level, double[] intervalsFromTop, String source) {
        Species species = Species.parse(name);
        State state = State.parse(level);
        var levels = HyperfineStructure.levels(CONTEXT.nucleus(species).twiceSpin(), state.twoJ(),
                CONTEXT.alkaliHyperfine().constants(species, state).orElseThrow().constants());
        for (int k = 0; k < intervalsFromTop.length; k++) {
            int top = levels.size() - 1 - k;
            double interval = levels.get(top).shiftHertz() - levels.get(top - 1).shiftHertz();
            assertEquals(intervalsFromTop[k] * 1e6, interval, 1e5, name + " " + level + " interval " + k + " (" + source + ")");
        }
    }

    @Test
    void rb87D2ComponentsThroughTheContext() {
        Species rb87 = Species.parse("Rb-87 I");
        List<HyperfineComponent> comps = CONTEXT.alkaliHyperfine().components(CONTEXT, rb87, State.parse("5s1/2"),
                State.parse("5p3/2"));
        assertEquals(6, comps.size());
        assertEquals(1, comps.stream().mapToDouble(HyperfineComponent::relativeStrength).sum(), 1e-12);
        HyperfineComponent cycling = comps.stream().filter(c -> c.twoFLower() == 4 && c.twoFUpper() == 6).findFirst()
                .orElseThrow();
        // centroid 384 230 484.4685 MHz - 5/8 ... F = 2 lies 3A/4 = 2563.005979 MHz above the ground centroid and
        // F' = 3 lies 193.7407 MHz above the 5p3/2 centroid (both from the constants, by hand)
        assertEquals((384230484.4685 - 2563.005979 + 193.7407) * 1e6, cycling.frequencyHertz(), 2e4);
        List<ZeemanComponent> zeeman = CONTEXT.alkaliHyperfine().zeemanComponents(CONTEXT, rb87, State.parse("5s1/2"),
                State.parse("5p3/2"), 1e-3);
        assertEquals(1, zeeman.stream().mapToDouble(ZeemanComponent::relativeStrength).sum(), 1e-10);
        ReferenceDataException none = assertThrows(ReferenceDataException.class, () -> CONTEXT.alkaliHyperfine()
                .components(CONTEXT, rb87, State.parse("5s1/2"), State.parse("6p3/2")));
        assertTrue(none.getMessage().contains("no hyperfine constants for Rb-87 I 6p"), none.getMessage());
    }

    @Test
    void aBadRowIsReportedWithFileAndLine() throws IOException {
        String dLines = "# ritzwerk-d-lines 1\n# id: x\n# source: y\n# provenance: published\n"
                + String.join(",", AlkaliHyperfine.D_LINE_COLUMNS) + "\n"
                + "Rb-87 I,D2,1.589049462,0.000000038,eV,published,rounded,none\n";
        try (InputStream h = AlkaliHyperfine.class.getResourceAsStream("rydberg/hyperfine-constants.csv")) {
            ReferenceDataException e = assertThrows(ReferenceDataException.class, () -> AlkaliHyperfine.read(
                    new ByteArrayInputStream(dLines.getBytes(StandardCharsets.UTF_8)), "mine.csv", h, "hf.csv"));
            assertEquals(ReferenceDataException.BAD_BUILT_IN, e.code());
            assertTrue(e.getMessage().startsWith("mine.csv:6: unit must be one of"), e.getMessage());
        }
    }
}
