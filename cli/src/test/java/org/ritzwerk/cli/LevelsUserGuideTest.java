package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.levels.LevelQuery;
import org.ritzwerk.engine.levels.LevelSet;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.DataLevels;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The README's level-query example ("Using the library") gives the rows the {@code levels}
 * command prints, number for number: F levels, lifetimes, the model column.
 */
class LevelsUserGuideTest {

    @Test
    void theLibraryQueryIsTheLevelsCommand() {
        DataContext data = DataContext.builtIn();
        LevelSet cs = LevelQuery.defaults().withMaxN(7).withMaxL(1).withLifetimes(true).withHyperfine(true)
                .run(DataLevels.sources(data, List.of(Species.parse("H I"), Species.parse("Cs-133 I")), Tier.QED));

        JsonMapper json = JsonMapper.builder().build();
        List<JsonNode> rows = CliTest.run("levels", "--species", "H I,Cs-133 I", "--n-max", "7", "--l-max", "1",
                "--lifetimes", "--hyperfine", "--format", "json").out().lines().map(json::readTree).toList();
        assertEquals(cs.size(), rows.size());
        for (int i = 0; i < rows.size(); i++) {
            JsonNode row = rows.get(i);
            String where = "row " + i + " " + row;
            assertEquals(cs.species(i).notation(), row.get("species").asString(), where);
            assertEquals(cs.label(i), row.get("label").asString(), where);
            assertEquals(cs.energyPerCm(i), row.get("energy_per_cm").asDouble(), 0.0, where);
            assertEquals(cs.model(i), row.get("model").asString(), where);
            assertEquals(cs.statisticalWeight(i).getAsInt(), row.get("g").asInt(), where);
            assertEquals(cs.twoF(i).isPresent(), !row.get("hyperfine_f").isNull(), where);
            if (cs.lifetimeSeconds(i).isPresent()) {
                assertEquals(cs.lifetimeSeconds(i).getAsDouble(), row.get("lifetime_s").asDouble(), 0.0, where);
            } else {
                assertEquals(true, row.get("lifetime_s").isNull(), where);
            }
        }
    }
}
