package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.data.QuantumDefects;
import org.ritzwerk.engine.rydberg.AlkaliAtom;

/**
 * The quantum-defect uncertainties the project derives itself where no paper states one
 * ({@code uncertainty-provenance} from-residuals; check R of make_rydberg_data.py): u(d0) is the root mean
 * square, over the measured levels at n >= valid-from-n, of sqrt(r^2 + u^2) n*^3 / (2 R_M), r = formula -
 * measured and u the level's stated uncertainty, both as fit-residuals.txt prints them (column
 * formula-measured; u = allowed - 0.10, the ground level exact).
 */
class ResidualDerivedUncertaintyTest {

    private static final DataContext DATA = DataContext.builtIn();

    /**
     * Na s1/2 by hand from fit-residuals.txt (R_M = 109 734.697 cm-1 for Na-23; n* = n - delta(n) of the
     * file's defects), n: r, u -> dd0: 3: +0.0692, 0 -> 1.36e-6; 4: -0.0293, 0.0005 -> 2.47e-6; 5: +0.0530,
     * 0.0005 -> 1.17e-5; 6: +0.0268 -> 1.23e-5; 7: +0.0133 -> 1.09e-5; 8: +0.0060, 0.005 -> 1.05e-5; 9:
     * +0.0021, 0.005 -> 1.11e-5; 10: -0.0052, 0.005 -> 2.13e-5; 11: +0.0017, 0.0005 -> 7.26e-6; 12: +0.0012,
     * 0.0005 -> 7.16e-6; RMS 1.0975e-5, written rounded up to two digits: 0.000011.
     */
    @Test
    void sodiumSDefectUncertaintyIsTheRmsOfItsResidualFile() throws IOException {
        QuantumDefects na = DATA.alkaliAtom(Species.parse("Na-23 I")).quantumDefects();
        QuantumDefects.Series s = na.series().stream().filter(x -> x.l() == 0).findFirst().orElseThrow();
        double sum = 0;
        int count = 0;
        for (String[] f : rows("na-23", "s1/2")) {
            int n = Integer.parseInt(f[2]);
            if (n < s.validFromN()) {
                continue;
            }
            double r = Double.parseDouble(f[5]);
            double u = Double.parseDouble(f[3]) == 0 ? 0 : Double.parseDouble(f[6]) - 0.10;
            double nStar = n - AlkaliAtom.rydbergRitzDefect(s.coefficients(), n);
            double dd0 = Math.hypot(r, u) * nStar * nStar * nStar / (2 * na.rydbergPerCm());
            sum += dd0 * dd0;
            count++;
        }
        assertEquals(10, count);
        double rms = Math.sqrt(sum / count);
        assertEquals(1.0975e-5, rms, 0.0005e-5, "the hand computation above");
        assertTrue(s.residualDerived());
        assertEquals(List.of(0.000011, 0.0, 0.0, 0.0), s.uncertainties(), "u(d0) rounded up, u(d2).. 0");
        assertEquals(Math.ceil(rms * 1e6) / 1e6, s.uncertainties().get(0), 1e-15);
    }

    /**
     * Na 30s: u(E)^2 = ((d delta / d d0) 2 R_M / n*^3 u(d0))^2 + u(limit)^2. The first term is 1.026e-4 cm-1
     * (3.08 MHz; check R of fit-residuals.txt; by hand with the script's ritz_uncertainty), the second the
     * limit's, ours since no source states one (check R limit: the largest root mean square of sqrt(r^2 + u^2)
     * over a series' checked levels, Na d5/2 n = 6-10, 0.0386 cm-1, rounded up to 0.039): sqrt(1.026e-4^2 +
     * 0.039^2) = 0.0390001 cm-1, 1.17 GHz. The limit's part is shared by the atom's levels and cancels between
     * two formula levels (AlkaliAtom.frequencyUncertaintyHz). Before the derived figures the level had none;
     * with u(d0) alone it read 3.08 MHz, which a constant offset of the kind Na p shows at n = 10-11 (+0.010
     * cm-1 against the tabulated levels) would exceed a hundredfold.
     */
    @Test
    void formulaLevelsOfSeriesWithoutStatedUncertaintiesNowCarryTheDerivedOne() {
        AlkaliAtom na = DATA.alkaliAtom(Species.parse("Na-23 I"));
        State s30 = State.parse("30s1/2");
        assertEquals(0.039, na.quantumDefects().limitUncertaintyPerCm(), 1e-15);
        double expected = Math.hypot(1.0264e-4, 0.039);
        assertEquals(expected, na.level(s30).energyUncertaintyPerCm().getAsDouble(), 1e-9);
        // the ground level is the exact zero: the 3s - 30s line carries the 30s level's alone
        assertEquals(expected * 299_792_458.0 * 100, na.frequencyUncertaintyHz(State.parse("3s1/2"), s30)
                .getAsDouble(), 1e-9 * 299_792_458.0 * 100);
        // between two formula levels the limit cancels: 30s - 31p carries the defects' parts only, far below it
        assertTrue(na.frequencyUncertaintyHz(s30, State.parse("31p1/2")).getAsDouble() < 0.001 * 299_792_458.0 * 100);
        for (String[] c : new String[][] {{"K-39 I", "40p3/2"}, {"Li-7 I", "30d5/2"}, {"Rb-85 I", "50s1/2"},
                {"Cs-133 I", "40d3/2"}, {"Li-6 I", "30d5/2"}, {"K-40 I", "40p3/2"}, {"K-41 I", "40p3/2"},
                {"Rb-85 I", "40p3/2"}}) {
            AlkaliAtom atom = DATA.alkaliAtom(Species.parse(c[0]));
            double u = atom.level(State.parse(c[1])).energyUncertaintyPerCm().orElse(Double.NaN);
            double limit = atom.quantumDefects().limitUncertaintyPerCm();
            // at least the limit's (stated, or ours where none is: 0.14 cm-1 Li-7, 0.52 Li-6, 0.064 Rb-85,
            // 0.019 K-40, 0.02 K-41; check R limit), and a defect term of at most 0.03 cm-1 beside it
            assertTrue(u >= limit && u < Math.hypot(limit, 0.03), c[0] + " " + c[1] + ": " + u + " (limit " + limit
                    + ")");
        }
        // series with no uncertainty of their defects and no measured level at n >= valid-from-n keep none (Li s,
        // p, f)
        AlkaliAtom li = DATA.alkaliAtom(Species.parse("Li-7 I"));
        assertTrue(li.level(State.parse("30s1/2")).energyUncertaintyPerCm().isEmpty());
        assertTrue(li.level(State.parse("30f7/2")).energyUncertaintyPerCm().isEmpty());
    }

    @Test
    void theProvenanceIsWrittenBackAndAFromResidualsRowNeedsEveryUncertainty() {
        QuantumDefects na = DATA.alkaliAtom(Species.parse("Na-23 I")).quantumDefects();
        String text = QuantumDefectFiles.writeCsv(na);
        assertTrue(text.contains(",from-residuals,"), text);
        QuantumDefects back = QuantumDefectFiles.read(new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)),
                "na.csv").defects();
        assertEquals(na.series(), back.series());
        // u(d2) of the s row left empty: a residual-derived row states every coefficient's
        String bad = text.replace(",1.1E-5,0.0,", ",1.1E-5,,");
        assertTrue(!bad.equals(text), bad);
        byte[] badBytes = bad.getBytes(StandardCharsets.UTF_8);
        DataFileException e = assertThrows(DataFileException.class,
                () -> QuantumDefectFiles.read(new ByteArrayInputStream(badBytes), "na.csv"));
        assertTrue(e.getMessage().contains("residual-derived uncertainties must be given for every coefficient"),
                e.getMessage());
    }

    private static List<String[]> rows(String atom, String series) throws IOException {
        try (InputStream in = ResidualDerivedUncertaintyTest.class
                .getResourceAsStream("/org/ritzwerk/refdata/rydberg/fit-residuals.txt");
                BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
            return reader.lines().map(line -> line.strip().split("\\s+"))
                    .filter(f -> f.length >= 7 && f[0].equals(atom) && f[1].equals(series)).toList();
        }
    }
}
