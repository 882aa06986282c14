package org.ritzwerk.cli;

import java.util.ArrayList;
import java.util.List;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.refdata.NuclearData;

/** Turns the --species and --model options into level models of one-electron ions. */
final class Ions {

    private Ions() {
    }

    /** A species with its model. */
    record Ion(Species species, HydrogenLikeModel model) {
    }

    /**
     * @param speciesOptions the --species values, each possibly a comma-separated list
     * @param tierId         the --model value
     * @return the models, in the order given
     */
    static List<Ion> of(List<String> speciesOptions, String tierId) {
        Tier tier = Tier.fromId(tierId);
        List<Ion> ions = new ArrayList<>();
        for (String option : speciesOptions) {
            for (String text : option.split(",")) {
                if (text.isBlank()) {
                    throw new IllegalArgumentException("--species has an empty entry in '" + option + "'");
                }
                Species species = Species.parse(text);
                if (!species.isHydrogenLike()) {
                    throw new IllegalArgumentException(species.notation() + " has " + (species.z() - species.charge())
                            + " electrons; levels and lines cover one-electron ions (H I, D I, He II, C VI, ...) so far");
                }
                ions.add(new Ion(species, HydrogenLikeModel.of(NuclearData.builtIn().nucleus(species), tier)));
            }
        }
        return ions;
    }
}
