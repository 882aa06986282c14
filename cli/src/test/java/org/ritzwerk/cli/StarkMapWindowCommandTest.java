package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.stark.StarkMap;
import org.ritzwerk.engine.stark.StarkMapResult;
import org.ritzwerk.refdata.DataContext;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * {@code rydberg stark-map} computes the shares only within its --window; its rows are those of the
 * library's map solved with every share: the same rows, energies to 1e-9 GHz, shares to 1e-9.
 */
class StarkMapWindowCommandTest {

    private static final JsonMapper JSON = JsonMapper.builder().build();

    @Test
    void rowsEqualTheFullSolve() {
        CliTest.Run run = CliTest.run("rydberg", "stark-map", "--species", "Rb-87 I", "--state", "40d5/2", "--n-min",
                "39", "--n-max", "41", "--l-max", "8", "--field-max", "20", "--steps", "4", "--window", "30",
                "--format", "json");
        assertEquals(0, run.code(), run.err());
        AlkaliAtom rb = DataContext.builtIn().alkaliAtom(Species.parse("Rb-87 I"));
        State state = State.of(40, 2, 5);
        StarkMap map = StarkMap.builder(rb).projection(1).principalRange(39, 41).maxOrbital(8).build();
        double[] fields = new double[5];
        for (int k = 0; k <= 4; k++) {
            fields[k] = 20.0 * k / 4 * 100;
        }
        StarkMapResult full = map.solve(fields, state);
        List<double[]> want = new ArrayList<>();
        for (int f = 0; f < fields.length; f++) {
            double[] e = full.energiesRelativeHz(f);
            double[] c = full.characters(f);
            for (int i = 0; i < e.length; i++) {
                if (Math.abs(e[i] / 1e9) <= 30) {
                    want.add(new double[] {fields[f] / 100, e[i] / 1e9, c[i]});
                }
            }
        }
        String[] lines = run.out().strip().split("\\R");
        assertEquals(want.size(), lines.length, run.out());
        assertTrue(want.size() < 5 * map.size(), "the window must leave states out for the test to mean anything");
        for (int r = 0; r < lines.length; r++) {
            JsonNode row = JSON.readTree(lines[r]);
            double[] w = want.get(r);
            assertEquals(w[0], row.get("field_v_per_cm").asDouble(), 0.0, lines[r]);
            assertEquals(w[1], row.get("energy_ghz").asDouble(), 1e-9, lines[r]);
            assertEquals(w[2], row.get("share").asDouble(), 1e-9, lines[r]);
        }
    }
}
