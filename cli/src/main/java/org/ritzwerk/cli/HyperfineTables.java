package org.ritzwerk.cli;

import static org.ritzwerk.engine.hydrogenic.Notation.half;

import java.io.PrintWriter;
import java.util.List;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hyperfine.HyperfineComponent;
import org.ritzwerk.engine.hyperfine.ZeemanComponent;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.refdata.AlkaliHyperfine;
import org.ritzwerk.refdata.DataContext;

/**
 * {@code lines --hyperfine}: the F -> F' components of the D lines of alkali isotopes, and with
 * {@code --field-tesla} their m_F-resolved Zeeman components. Formatting only: the components come
 * from {@link AlkaliHyperfine}.
 */
final class HyperfineTables {

    /** The option that asks for Zeeman components, in tesla. */
    static final String FIELD_OPTION = "--field-tesla";
    /** The option that gives the field's standard uncertainty, in tesla. */
    static final String FIELD_UNCERTAINTY_OPTION = "--field-uncertainty-tesla";

    /**
     * What a Zeeman component's {@code u Hz}, {@code dnu/dB} and {@code mJ mI weight} columns hold.
     *
     * @param fieldUncertaintyTesla the field's standard uncertainty as given, tesla, or null when not given
     * @return the note
     */
    static String zeemanNote(Double fieldUncertaintyTesla) {
        String field = fieldUncertaintyTesla == null ? "the field's (taken as exact; give " + FIELD_UNCERTAINTY_OPTION
                + "), " : "";
        String given = fieldUncertaintyTesla == null ? "" : ", and the field's, |dnu/dB| times the "
                + FIELD_UNCERTAINTY_OPTION + " " + fieldText(fieldUncertaintyTesla) + " T (first order: near a "
                + "turning point, dnu/dB about 0, the second-order part left out may be larger)";
        return "note: --field-tesla: u Hz is each component's own standard uncertainty: its centroid's and its two "
                + "states' energies' from the stated uncertainties of A and B (first order, by the Hellmann-Feynman "
                + "theorem; at 0 T those of the F -> F' components), as independent" + given + "; left out: the g "
                + "factors', " + field + "and the fine-structure splitting's (it enters only through the field's "
                + "mixing of p1/2 and p3/2). dnu/dB: the component's first derivative by the field at this field, "
                + "MHz per mT (JSON and CSV field_slope_hz_per_t, Hz per tesla; exact by Hellmann-Feynman; about 0 "
                + "for a field-insensitive component). mJ mI weight: each state's largest |m_J m_I> component and its "
                + "squared amplitude, the label that holds at high field, where F and mF only name the zero-field "
                + "level a state connects to; J' is that component's J, since p1/2 and p3/2 are diagonalised together "
                + "and the field mixes them (for Li from about a tesla up the largest may be the other J) (README, "
                + "Hyperfine and Zeeman structure)";
    }

    private HyperfineTables() {
    }

    /**
     * Prints the components of the D1 and D2 lines of every atom.
     *
     * @param context    the data context
     * @param atoms      alkali atoms (isotopes)
     * @param fieldTesla the field in tesla, or null for the zero-field F -> F' components
     * @param fieldUncertaintyTesla the field's standard uncertainty in tesla, or null to take the field as exact
     * @param air        whether to add each component's wavelength in standard air
     * @param out        where the table goes
     * @param format     the table format
     */
    static void print(DataContext context, List<AlkaliAtom> atoms, Double fieldTesla, Double fieldUncertaintyTesla,
            boolean air, PrintWriter out, Table.Format format) {
        AlkaliHyperfine data = context.alkaliHyperfine();
        for (AlkaliAtom atom : atoms) {
            if (data.dLines(atom.species()).isEmpty()) {
                throw new OptionException("--hyperfine: no D-line and hyperfine data for " + atom.species().notation()
                        + "; isotopes with data: " + String.join(", ", data.species().stream().map(Species::notation)
                                .toList()));
            }
        }
        boolean zeeman = fieldTesla != null;
        List<Table.Column> columns = new java.util.ArrayList<>(List.of(
                Table.Column.text("species", "species"),
                Table.Column.text("line", "line"),
                Table.Column.text("lower", "lower")));
        if (zeeman) { // each state's largest |m_J m_I> component: the label that holds at high field
            columns.addAll(List.of(Table.Column.text("lower_m_j", "mJ"), Table.Column.text("lower_m_i", "mI"),
                    Table.Column.number("lower_weight", "weight", "%.4f")));
        }
        columns.add(Table.Column.text("upper", "upper"));
        if (zeeman) {
            columns.addAll(List.of(Table.Column.text("upper_j", "J'"), Table.Column.text("upper_m_j", "mJ'"),
                    Table.Column.text("upper_m_i", "mI'"),
                    Table.Column.number("upper_weight", "weight'", "%.4f"),
                    Table.Column.text("polarisation", "pol")));
        }
        columns.add(Table.Column.number("frequency_hz", "Hz", "%.12e"));
        columns.add(Table.Column.number("uncertainty_hz", "u Hz", "%.2g"));
        if (zeeman) {
            columns.add(slopeColumn("dnu/dB MHz/mT"));
        }
        columns.addAll(List.of(
                Table.Column.number("offset_mhz", "MHz from centroid", "%.4f"),
                Table.Column.number("vacuum_wavelength_nm", "vacuum nm", "%.7f")));
        if (air) {
            columns.add(Table.Column.number("air_wavelength_nm", "air nm", "%.7f"));
        }
        columns.add(Table.Column.number("relative_strength", "share", zeeman ? "%.6g" : "%.6f"));
        if (zeeman) {
            columns.add(Table.Column.number("field_tesla", "T", "%.6g"));
        }
        if (fieldUncertaintyTesla != null) {
            columns.add(Table.Column.number("field_uncertainty_tesla", "u T", "%.2g"));
        }
        Table table = new Table(columns, out, format);
        for (AlkaliAtom atom : atoms) {
            Species species = atom.species();
            State ground = atom.groundState();
            for (AlkaliHyperfine.DLine d : data.dLines(species)) {
                State upper = State.of(ground.n(), 1, d.twoJUpper());
                double centroid = atom.frequencyHz(ground, upper);
                if (zeeman) {
                    for (ZeemanComponent c : data.zeemanComponents(context, species, ground, upper, fieldTesla,
                            fieldUncertaintyTesla == null ? 0 : fieldUncertaintyTesla)) {
                        List<Object> row = new java.util.ArrayList<>(List.of(species.notation(), d.line(),
                                ground.notation() + " F=" + half(c.twoFLower()) + " mF=" + half(c.twoMFLower()),
                                c.lowerDominant().mJLabel(), c.lowerDominant().mILabel(), c.lowerDominant().weight(),
                                upper.notation() + " F'=" + half(c.twoFUpper()) + " mF'=" + half(c.twoMFUpper()),
                                half(c.upperDominant().twoJ()), c.upperDominant().mJLabel(),
                                c.upperDominant().mILabel(), c.upperDominant().weight(),
                                c.q() == 0 ? "pi" : c.q() > 0 ? "sigma+" : "sigma-"));
                        row.add(c.frequencyHertz());
                        row.add(c.frequencyUncertaintyHertz());
                        row.add(c.fieldSlopeHertzPerTesla());
                        addOffsetAndWavelengths(row, c.frequencyHertz(), centroid, air);
                        row.add(c.relativeStrength());
                        row.add(fieldTesla);
                        if (fieldUncertaintyTesla != null) {
                            row.add(fieldUncertaintyTesla);
                        }
                        table.add(row.toArray());
                    }
                } else {
                    for (HyperfineComponent c : data.components(context, species, ground, upper)) {
                        List<Object> row = new java.util.ArrayList<>(List.of(species.notation(), d.line(),
                                ground.notation() + " F=" + half(c.twoFLower()),
                                upper.notation() + " F'=" + half(c.twoFUpper())));
                        row.add(c.frequencyHertz());
                        row.add(c.frequencyUncertaintyHertz());
                        addOffsetAndWavelengths(row, c.frequencyHertz(), centroid, air);
                        row.add(c.relativeStrength());
                        table.add(row.toArray());
                    }
                }
            }
        }
        table.finish();
    }

    /**
     * Prints a ladder's F-resolved paths ({@code AlkaliHyperfine.ladderComponents}): the three levels, each
     * step's frequency, its offset from the step's fine-structure centroid, and its wavelength in vacuum and in
     * standard air (the air model of the plain {@code --ladder}; null outside it).
     */
    static void ladder(DataContext context, AlkaliAtom atom, State[] states, PrintWriter out, Table.Format format) {
        List<AlkaliHyperfine.LadderComponent> paths;
        try {
            paths = AlkaliHyperfine.ladderComponents(context, atom.species(), states[0], states[1], states[2]);
        } catch (org.ritzwerk.refdata.ReferenceDataException | IllegalArgumentException e) {
            throw new OptionException("--ladder with --hyperfine: " + e.getMessage(), e);
        }
        double first = atom.frequencyHz(states[0], states[1]);
        double second = atom.frequencyHz(states[1], states[2]);
        Table table = new Table(List.of(
                Table.Column.text("species", "species"),
                Table.Column.text("lower", "lower"),
                Table.Column.text("intermediate", "intermediate"),
                Table.Column.text("upper", "upper"),
                Table.Column.text("lower_f", "F"),
                Table.Column.text("intermediate_f", "F'"),
                Table.Column.text("upper_f", "F''"),
                Table.Column.number("first_frequency_hz", "step 1 Hz", "%.12e"),
                Table.Column.number("first_uncertainty_hz", "u Hz", "%.2g"),
                Table.Column.number("first_offset_mhz", "MHz from centroid", "%.4f"),
                Table.Column.number("first_vacuum_wavelength_nm", "vacuum nm", "%.7f"),
                Table.Column.number("first_air_wavelength_nm", "air nm", "%.7f"),
                Table.Column.number("second_frequency_hz", "step 2 Hz", "%.12e"),
                Table.Column.number("second_uncertainty_hz", "u Hz", "%.2g"),
                Table.Column.number("second_offset_mhz", "MHz from centroid", "%.4f"),
                Table.Column.number("second_vacuum_wavelength_nm", "vacuum nm", "%.7f"),
                Table.Column.number("second_air_wavelength_nm", "air nm", "%.7f")), out, format);
        for (AlkaliHyperfine.LadderComponent p : paths) {
            double firstVacuum = PhysicalConstants.C / p.firstHertz();
            double secondVacuum = PhysicalConstants.C / p.secondHertz();
            table.add(atom.species().notation(), states[0].notation(), states[1].notation(), states[2].notation(),
                    half(p.twoFLower()), half(p.twoFIntermediate()), half(p.twoFUpper()),
                    p.firstHertz(), p.firstUncertaintyHertz(), (p.firstHertz() - first) / 1e6, firstVacuum * 1e9,
                    AlkaliTables.air(firstVacuum) * 1e9, p.secondHertz(), p.secondUncertaintyHertz(),
                    (p.secondHertz() - second) / 1e6, secondVacuum * 1e9, AlkaliTables.air(secondVacuum) * 1e9);
        }
        table.finish();
    }

    /**
     * The note saying what a hyperfine ladder's {@code u Hz} holds, and for each level whose constants are a
     * Rydberg series' (scaled as n*^-3, or measured there without a B) what it leaves out.
     */
    static String ladderUncertaintyNote(DataContext context, AlkaliAtom atom, State[] states) {
        StringBuilder note = new StringBuilder("note: u Hz: each step's own standard uncertainty: its centroid's (the "
                + "plain --ladder's u Hz; '-', null in JSON, where that has none) and its two F levels' shifts' from "
                + "the stated uncertainties of A and B, as independent (no source states a covariance); components "
                + "sharing a level share its A and B errors, so their offsets from each other are known better "
                + "(README, Rydberg states of alkali atoms)");
        Species species = atom.species();
        for (State state : states) {
            if (context.alkaliHyperfine().constants(species, state).isPresent()) {
                continue;
            }
            String origin = context.hyperfineConstantsOrigin(species, state).orElse("");
            var c = context.hyperfineConstants(species, state).orElseThrow();
            boolean noB = state.twoJ() > 1 && Double.isNaN(c.bUncertaintyHertz());
            boolean measured = origin.equals("measured");
            if (measured && !noB) {
                continue; // a Rydberg series' own measured level with A and B: nothing left out
            }
            note.append(String.format(java.util.Locale.ROOT, "; %s (A = %.6g MHz, %s)", state.notation(),
                    c.aHertz() / 1e6, origin));
            if (!measured) {
                note.append(": its u(A) holds the stated uncertainty of its series' constant, scaled like A, and "
                        + "the n*^-3 law's own error (the drift of A n*^3 per n between measured levels, times the "
                        + "distance in n from the nearest, at most the largest change seen; README)");
                if (origin.contains("isotope ratio")) {
                    note.append(", not the isotope ratio's hyperfine anomaly");
                }
            }
            if (noB) {
                note.append(measured ? ": " : "; ").append("no B is given for it: the quadrupole term and its "
                        + "uncertainty are left out");
            }
        }
        return note.toString();
    }

    /**
     * The note naming the sources of an atom's D-line centroids and hyperfine constants, with their provenance.
     */
    static String sourcesNote(DataContext context, AlkaliAtom atom) {
        AlkaliHyperfine data = context.alkaliHyperfine();
        List<String> items = new java.util.ArrayList<>();
        for (AlkaliHyperfine.DLine d : data.dLines(atom.species())) {
            items.add(d.line() + " centroid: " + d.source() + " (" + d.provenance().id() + ")");
        }
        for (AlkaliHyperfine.LevelConstants c : data.constants(atom.species())) {
            items.add(c.state().notation() + " A, B: " + c.source() + " (" + c.provenance().id() + ")");
        }
        return "note: " + atom.species().notation() + " sources: " + String.join("; ", items)
                + "; nuclear spin and moment: the isotope table (ritzwerk data show nuclear-isotopes)";
    }

    /**
     * @param heading the text heading
     * @return the field slope's column, {@code field_slope_hz_per_t}: Hz per tesla in JSON and CSV, MHz per mT
     *         (1e9 Hz per tesla) in text
     */
    static Table.Column slopeColumn(String heading) {
        return new Table.Column("field_slope_hz_per_t", heading, value -> Table.unsignedZero(
                String.format(java.util.Locale.ROOT, "%.6f", ((Double) value) / 1e9)));
    }

    /** Reads a number of tesla given without a unit; a value with a unit gets a message naming the option. */
    private abstract static class PlainTesla implements picocli.CommandLine.ITypeConverter<Double> {
        /** @return what the option takes, with examples, e.g. "the field in tesla ... (e.g. 1e-4 for 1 G)" */
        abstract String takes();

        @Override
        public Double convert(String value) {
            try {
                return Double.valueOf(value.strip());
            } catch (NumberFormatException e) {
                throw new picocli.CommandLine.TypeConversionException("'" + value + "' is not a number: " + takes());
            }
        }
    }

    /** Reads {@code --field-tesla}: a plain number of tesla; a value with a unit gets a message saying so. */
    static final class Tesla extends PlainTesla {
        @Override
        String takes() {
            return FIELD_OPTION + " takes the field in tesla as a plain number, without a unit (e.g. 1e-4 for 1 G, "
                    + "0.001 for 1 mT)";
        }
    }

    /** Reads {@code --field-uncertainty-tesla}: a plain number of tesla; with a unit, a message saying so. */
    static final class FieldUncertainty extends PlainTesla {
        @Override
        String takes() {
            return FIELD_UNCERTAINTY_OPTION + " takes the field's standard uncertainty in tesla as a plain number, "
                    + "without a unit (e.g. 1e-6 for 10 mG, 1e-7 for 1 mG)";
        }
    }

    /**
     * The note that the components leave out the diamagnetic shift, with its size on each D line at this field:
     * {@code AlkaliHyperfine.diamagneticLineShiftHertz} on each D line, each level's from the model's
     * {@code <r^2>}.
     */
    static String diamagneticNote(AlkaliAtom atom, double fieldTesla) {
        State ground = atom.groundState();
        double d1 = AlkaliHyperfine.diamagneticLineShiftHertz(atom, ground, new State(ground.n(), 1, 1), fieldTesla);
        double d2 = AlkaliHyperfine.diamagneticLineShiftHertz(atom, ground, new State(ground.n(), 1, 3), fieldTesla);
        return String.format(java.util.Locale.ROOT, "note: %s: the diamagnetic (B^2) shift is left out of the "
                + "components: at %s T it moves D1 by about %+.2g Hz and D2 by about %+.2g Hz (e^2 B^2 (2/3) <r^2> / "
                + "8 m_e for each level, <r^2> of the model's wavefunctions, m-averaged; it grows as B^2)",
                atom.species().notation(), fieldText(fieldTesla), d1, d2);
    }

    /** @return the field as typed for the usual fields (0.0001), in powers of ten beyond them (1E-160) */
    static String fieldText(double fieldTesla) {
        java.math.BigDecimal field = new java.math.BigDecimal(Double.toString(fieldTesla)).stripTrailingZeros();
        return field.scale() > 12 ? field.toString() : field.toPlainString();
    }

    private static void addOffsetAndWavelengths(List<Object> row, double hertz, double centroidHertz, boolean air) {
        double vacuumMetres = PhysicalConstants.C / hertz;
        row.add((hertz - centroidHertz) / 1e6);
        row.add(vacuumMetres * 1e9);
        if (air) {
            row.add(AlkaliTables.air(vacuumMetres) * 1e9);
        }
    }
}
