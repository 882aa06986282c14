package org.ritzwerk.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.ritzwerk.data.DataSet;
import org.ritzwerk.data.Isotope;
import org.ritzwerk.data.IsotopeTable;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.QuantumDefects;
import org.ritzwerk.engine.hydrogenic.Notation;
import org.ritzwerk.refdata.DataRegistry;
import org.ritzwerk.refdata.IsotopeFiles;
import org.ritzwerk.refdata.LevelListFiles;
import org.ritzwerk.refdata.LineListFiles;
import org.ritzwerk.refdata.QuantumDefectFiles;
import org.ritzwerk.refdata.UserFiles;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

/** {@code ritzwerk data}: the reference data sets, their sources, and checks of user files. */
@Command(name = "data",
        mixinStandardHelpOptions = true,
        header = "List, show and check the reference data sets.",
        description = "List the reference data sets with their sources (built-in, from provider jars on the "
                + "class path, and your own files given with --file), in order of precedence: your files, "
                + "then third parties, then built-in. 'data show ID' prints one set; 'data check FILE' "
                + "checks a file (line list, level table, quantum-defect set or isotope table) and reports "
                + "every problem. The other commands take the same files with --data.",
        subcommands = {DataCommand.Show.class, DataCommand.Check.class},
        footer = {"", "Examples:",
            "  ritzwerk data",
            "  ritzwerk data show lamp-ne-i",
            "  ritzwerk data show lamp-ne-i --format csv > my-neon.csv",
            "  ritzwerk data check my-neon.csv",
            "  ritzwerk data --file my-neon.csv"})
final class DataCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    // Both options are inherited by 'show' and 'check', and picocli keeps one value for the command
    // and its subcommands: 'data --file F show ID' and 'data show ID --file F' are the same command.
    @Option(names = {"--file", "--data"}, paramLabel = "FILE", scope = CommandLine.ScopeType.INHERIT,
            description = "Add a file of your own: a line list or level table (CSV or JSON), a quantum-defect set "
                    + "or an isotope table. Repeatable.")
    List<Path> files = new ArrayList<>();

    @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "text", scope = CommandLine.ScopeType.INHERIT,
            description = "text (aligned table), csv or json (one object per line); 'show' writes any set in csv, "
                    + "and a line list or level table in json, in its file format. Default: ${DEFAULT-VALUE}.")
    Table.Format format;

    @Override
    public Integer call() {
        Table table = new Table(List.of(
                Table.Column.text("id", "id"),
                Table.Column.text("kind", "kind"),
                Table.Column.text("origin", "origin"),
                Table.Column.text("provider", "provider"),
                Table.Column.text("version", "version"),
                Table.Column.text("title", "title"),
                Table.Column.text("source", "source")), spec.commandLine().getOut(), format);
        for (DataRegistry.Listing listing : registry(files).list()) {
            String source = listing.info().provenance().render();
            table.add(listing.info().id(), listing.info().kind().id(), listing.origin().name().toLowerCase()
                    .replace('_', '-'), listing.providerId(), listing.info().version(), listing.info().title(),
                    format == Table.Format.text && source.length() > 60 ? source.substring(0, 57) + "..." : source);
        }
        table.finish();
        return 0;
    }

    /** The registry of every discovered provider plus the user's files (the command line's data context). */
    static DataRegistry registry(List<Path> files) {
        return DataOptions.context(files).registry();
    }

    /** {@code ritzwerk data show ID}. */
    @Command(name = "show", mixinStandardHelpOptions = true, header = "Print one data set.",
            description = "Print one data set. --format csv writes any set in its file format, ready to edit and "
                    + "use with --file; json does so for a line list or level table.")
    static final class Show implements Callable<Integer> {

        @Spec
        CommandSpec spec;

        @ParentCommand
        DataCommand parent;

        @Parameters(paramLabel = "ID", description = "The data set id, as 'ritzwerk data' lists it.")
        String id;

        @Override
        public Integer call() {
            List<Path> files = parent.files;
            Table.Format format = parent.format;
            DataRegistry registry = registry(files);
            DataSet set = registry.load(id);
            PrintWriter out = spec.commandLine().getOut();
            if (set instanceof LineList && format != Table.Format.text) {
                LineList list = (LineList) set;
                out.print(format == Table.Format.csv ? LineListFiles.writeCsv(list) : LineListFiles.writeJson(list));
                out.flush();
                return 0;
            }
            if (set instanceof LevelList && format != Table.Format.text) {
                LevelList levels = (LevelList) set;
                out.print(format == Table.Format.csv ? LevelListFiles.writeCsv(levels) : LevelListFiles.writeJson(levels));
                out.flush();
                return 0;
            }
            if (set instanceof QuantumDefects && format == Table.Format.csv) {
                out.print(QuantumDefectFiles.writeCsv((QuantumDefects) set));
                out.flush();
                return 0;
            }
            if (set instanceof IsotopeTable && format == Table.Format.csv) {
                out.print(IsotopeFiles.writeCsv((IsotopeTable) set));
                out.flush();
                return 0;
            }
            DataRegistry.Listing listing = registry.find(id).orElseThrow();
            if (format == Table.Format.text) {
                out.println(set.info().title() + " (" + set.info().id() + ", " + set.info().kind().id() + ", version "
                        + set.info().version() + ", " + listing.origin().name().toLowerCase().replace('_', '-')
                        + " from " + listing.providerId() + ")");
                out.println("Source: " + set.info().provenance().render());
                if (set instanceof LineList && !((LineList) set).note().isEmpty()) {
                    out.println("Note: " + ((LineList) set).note());
                }
                out.println();
            }
            tableOf(set, out, format);
            return 0;
        }

        private static void tableOf(DataSet set, PrintWriter out, Table.Format format) {
            if (set instanceof LineList) {
                LineList list = (LineList) set;
                String unit = list.unit().symbol() + (list.medium() == null ? "" : " " + list.medium().spec());
                Table table = new Table(List.of(Table.Column.text("species", "species"),
                        Table.Column.text("position", "position " + unit), Table.Column.text("uncertainty", "+-"),
                        Table.Column.text("intensity", "intensity"), Table.Column.text("strength", "strength"),
                        Table.Column.number("einstein_a", "A s-1", "%.4e"), Table.Column.text("lower", "lower"),
                        Table.Column.text("upper", "upper"), Table.Column.text("note", "note")), out, format);
                for (int i = 0; i < list.size(); i++) {
                    table.add(list.species(i).notation(), list.position(i),
                            list.uncertainty(i).isPresent() ? (Object) list.uncertainty(i).getAsDouble() : null,
                            list.intensity(i).isPresent() ? (Object) list.intensity(i).getAsDouble() : null,
                            list.strength(i) == null ? null : list.strength(i).id(),
                            list.einsteinA(i).isPresent() ? (Object) list.einsteinA(i).getAsDouble() : null,
                            list.lower(i), list.upper(i), list.rowNote(i));
                }
                table.finish();
                return;
            }
            if (set instanceof LevelList) {
                LevelList levels = (LevelList) set;
                Table table = new Table(List.of(Table.Column.text("species", "species"), Table.Column.text("label", "level"),
                        Table.Column.text("j", "j"), Table.Column.number("energy", "energy " + levels.unit().symbol(),
                                "%.7f")), out, format);
                for (int i = 0; i < levels.size(); i++) {
                    table.add(levels.species(i).notation(), levels.label(i),
                            levels.twoJ(i) < 0 ? null : Notation.half(levels.twoJ(i)), levels.energy(i));
                }
                table.finish();
                return;
            }
            if (set instanceof QuantumDefects) {
                QuantumDefects defects = (QuantumDefects) set;
                Table table = new Table(List.of(Table.Column.text("l", "l"), Table.Column.text("j", "j"),
                        Table.Column.text("coefficients", "d0, d2, d4, ..."), Table.Column.text("valid_from_n", "from n")), out, format);
                for (QuantumDefects.Series series : defects.series()) {
                    table.add(series.l(), Notation.half(series.twoJ()), series.coefficients().toString(),
                            series.validFromN());
                }
                table.finish();
                return;
            }
            IsotopeTable isotopes = (IsotopeTable) set;
            Table table = new Table(List.of(Table.Column.text("z", "Z"), Table.Column.text("a", "A"),
                    Table.Column.text("mass_u", "mass u"), Table.Column.text("spin", "I"),
                    Table.Column.text("moment_nm", "moment nm"), Table.Column.text("radius_fm", "radius fm"),
                    Table.Column.text("source", "source")), out, format);
            for (Isotope isotope : isotopes.isotopes()) {
                table.add(isotope.z(), isotope.massNumber(), isotope.atomicMass(), Notation.half(isotope.twiceSpin()),
                        isotope.magneticMoment().isPresent() ? (Object) isotope.magneticMoment().getAsDouble() : null,
                        isotope.chargeRadiusFm().isPresent() ? (Object) isotope.chargeRadiusFm().getAsDouble() : null,
                        isotope.source());
            }
            table.finish();
        }
    }

    /** {@code ritzwerk data check FILE...}. */
    @Command(name = "check", mixinStandardHelpOptions = true,
            header = "Check files in the ritzwerk-lines or ritzwerk-levels format.",
            description = "Check files in the ritzwerk-lines or ritzwerk-levels format (CSV or JSON). One line per "
                    + "good file; for a bad file, every problem with file, line, column and reason (exit code "
                    + "2).")
    static final class Check implements Callable<Integer> {

        @Spec
        CommandSpec spec;

        @ParentCommand
        DataCommand parent;

        @Parameters(paramLabel = "FILE", arity = "1..*", description = "Files to check.")
        List<Path> files = new ArrayList<>();

        @Override
        public Integer call() {
            OptionRules rules = new OptionRules(spec);
            rules.refuseUnless("--file", false, "with 'data check' (give the files to check after 'check')");
            rules.refuseUnless("--data", false, "with 'data check' (give the files to check after 'check')");
            rules.refuseUnless("--format", false, "with 'data check' (it prints one line per file)");
            int code = 0;
            for (Path file : files) {
                try {
                    DataSet set = UserFiles.read(file);
                    String what;
                    if (set instanceof LineList) {
                        LineList list = (LineList) set;
                        what = list.size() + " lines of " + list.coveredSpecies().size() + " species in "
                                + list.unit().symbol() + (list.medium() == null ? "" : " " + list.medium().spec());
                    } else if (set instanceof LevelList) {
                        LevelList levels = (LevelList) set;
                        org.ritzwerk.refdata.DataLines.checkLevels(levels);
                        what = levels.size() + " levels of " + levels.info().species().size() + " species in "
                                + levels.unit().symbol() + (levels.correlationCount() == 0 ? ""
                                        : ", " + levels.correlationCount() + " correlated pairs")
                                + (levels.shareCount() == 0 ? "" : ", " + levels.uncertaintyComponents().size()
                                        + " shared uncertainty components (" + levels.shareCount()
                                        + " contributions)");
                    } else if (set instanceof QuantumDefects) {
                        QuantumDefects defects = (QuantumDefects) set;
                        what = defects.size() + " quantum-defect series of " + defects.species().notation();
                    } else {
                        what = set.size() + " isotopes";
                    }
                    spec.commandLine().getOut().println(file + ": ok, " + what + " (id " + set.info().id() + ")");
                } catch (org.ritzwerk.RitzwerkException e) {
                    spec.commandLine().getErr().println(e.getMessage());
                    code = ErrorReporter.BAD_INPUT;
                }
            }
            spec.commandLine().getOut().flush();
            return code;
        }
    }
}
