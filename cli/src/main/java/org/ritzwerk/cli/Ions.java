package org.ritzwerk.cli;

import java.util.ArrayList;
import java.util.List;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.refdata.DataContext;
import picocli.CommandLine.Option;

/** The --species and --model options shared by the commands on one-electron ions (a picocli mixin). */
final class Ions {

    @Option(names = "--species", paramLabel = "SPECIES",
            description = "Comma-separated or repeated: one-electron ions (\"H I\", D, \"He II\", C5+), or alkali "
                    + "atoms (\"Rb-87 I\", \"Cs I\") where the command takes them.")
    List<String> species = new ArrayList<>();

    @Option(names = "--model", paramLabel = "MODEL", defaultValue = "qed",
            description = "bohr, dirac, qed or hyperfine (default: ${DEFAULT-VALUE}).")
    String model;

    /**
     * @param data the data context (nuclear data)
     * @return the models of the ions named by the options, in the order given; at least one
     */
    List<Ion> resolve(DataContext data) {
        if (species.isEmpty()) {
            throw new OptionException("--species is required, e.g. --species \"H I\"");
        }
        return of(data, species, model);
    }

    /** A species with its model. */
    record Ion(Species species, HydrogenLikeModel model) {
    }

    /**
     * The species of the options: one-electron ions with their models, and neutral alkali atoms
     * (Li, Na, K, Rb, Cs isotopes with built-in Rydberg data) with theirs.
     *
     * @param ions    the one-electron ions, in the order given
     * @param alkalis the alkali atoms, in the order given
     */
    record Atoms(List<Ion> ions, List<AlkaliAtom> alkalis) {
    }

    /**
     * @param data the data context (nuclear data, quantum-defect sets)
     * @return the species of the options, one-electron ions and alkali atoms; at least one
     */
    Atoms resolveAtoms(DataContext data) {
        if (species.isEmpty()) {
            throw new OptionException("--species is required, e.g. --species \"H I\" or \"Rb-87 I\"");
        }
        return atoms(data, species, model);
    }

    /**
     * @param data           the data context (nuclear data, quantum-defect sets)
     * @param speciesOptions the --species values, each possibly a comma-separated list
     * @param tierId         the --model value, for the one-electron ions
     * @return the one-electron ions and the alkali atoms among them
     */
    static Atoms atoms(DataContext data, List<String> speciesOptions, String tierId) {
        List<String> oneElectron = new ArrayList<>();
        List<AlkaliAtom> alkalis = new ArrayList<>();
        for (String text : entries(speciesOptions)) {
            Species parsed = Species.parse(text);
            if (parsed.isHydrogenLike()) {
                oneElectron.add(text);
            } else if (parsed.charge() == 0 && data.alkaliSpecies().stream().anyMatch(s -> s.z() == parsed.z())) {
                alkalis.add(data.alkaliAtom(parsed));
            } else {
                List<Species> listed = data.levelSpecies();
                List<String> sameElement = listed.stream().filter(s -> s.z() == parsed.z()
                        && s.charge() == parsed.charge()).map(Species::notation).toList();
                throw new OptionException(parsed.notation() + ": levels and lines cover one-electron ions "
                        + "(H I, D I, He II, C VI, ...), the neutral alkali atoms "
                        + data.alkaliSpecies().stream().map(Species::notation).toList() + " and the species with "
                        + "a level list " + listed.stream().map(Species::notation).toList()
                        + (sameElement.isEmpty() ? "" : " (" + String.join(", ", sameElement) + " is listed, not "
                                + parsed.notation() + ")")
                        + "; another species needs a level list of your own (ritzwerk-levels format) with --data");
            }
        }
        return new Atoms(oneElectron.isEmpty() ? List.of() : of(data, oneElectron, tierId), alkalis);
    }

    /**
     * @param data           the data context (nuclear data)
     * @param speciesOptions the --species values, each possibly a comma-separated list
     * @param tierId         the --model value
     * @return the models, in the order given
     */
    static List<Ion> of(DataContext data, List<String> speciesOptions, String tierId) {
        Tier tier = Tier.fromId(tierId);
        List<Ion> ions = new ArrayList<>();
        for (String text : entries(speciesOptions)) {
            Species species = Species.parse(text);
            if (!species.isHydrogenLike()) {
                throw new OptionException(species.notation() + " has " + (species.z() - species.charge())
                        + " electrons; levels and lines cover one-electron ions (H I, D I, He II, C VI, ...) so far");
            }
            HydrogenLikeModel model;
            try {
                model = HydrogenLikeModel.of(data.nucleus(species), tier.forZ(species.z()));
            } catch (IllegalArgumentException e) {
                // a nuclear datum the model needs is missing (a charge radius for qed, say)
                throw new OptionException(species.notation() + ": " + e.getMessage() + "; use --model dirac, or give"
                        + " the nucleus's data in a file of your own with --data", e);
            }
            ions.add(new Ion(species, model));
        }
        return ions;
    }

    /**
     * @param ions    resolved ions
     * @param tierId  the --model value
     * @param command the command, for the note
     * @return a note for each ion that took another tier than asked (the qed tier ends at
     *         {@link HydrogenLikeModel#QED_MAX_Z}), to print on standard error
     */
    static List<String> tierNotes(List<Ion> ions, String tierId, String command) {
        Tier asked = Tier.fromId(tierId);
        List<String> notes = new ArrayList<>();
        for (Ion ion : ions) {
            if (ion.model().tier() != asked) {
                notes.add("note: " + command + ": " + ion.species().notation() + " takes the " + ion.model().tier().id()
                        + " model: the " + asked.id() + " model covers Z <= " + HydrogenLikeModel.QED_MAX_Z
                        + " (its self-energy, an expansion in Z alpha, fails beyond), so the Lamb shift is left out");
            }
        }
        return notes;
    }

    /** @return the entries of the --species values, each comma-separated list split; none blank */
    private static List<String> entries(List<String> speciesOptions) {
        List<String> entries = new ArrayList<>();
        for (String option : speciesOptions) {
            for (String text : option.split(",")) {
                if (text.isBlank()) {
                    throw new OptionException("--species has an empty entry in '" + option + "'");
                }
                entries.add(text);
            }
        }
        return entries;
    }
}
