package org.ritzwerk.spark;

import java.io.Serializable;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Objects;
import java.util.function.Function;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.broadcast.Broadcast;
import org.apache.spark.rdd.RDD;
import org.apache.spark.sql.Column;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.RowFactory;
import org.apache.spark.sql.catalyst.InternalRow;
import org.apache.spark.sql.types.StructType;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.ritz.RitzLevels;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.DataLines;

import static org.apache.spark.sql.functions.broadcast;
import static org.apache.spark.sql.functions.col;
import static org.apache.spark.sql.functions.count;
import static org.apache.spark.sql.functions.lit;

/** What the operations' per-partition setups share: the data context and the species' models. */
final class Setups {

    private Setups() {
    }

    /**
     * @param field  the parameter's name, for the message
     * @param values a list of a parameter record
     * @throws IllegalArgumentException naming the first null or blank element
     * @throws NullPointerException     when the list itself is null
     */
    static void requireNoNull(String field, List<?> values) {
        Objects.requireNonNull(values, field);
        for (int i = 0; i < values.size(); i++) {
            if (values.get(i) == null) {
                throw new IllegalArgumentException(field + " element " + i + " is null");
            }
            if (values.get(i) instanceof String text && text.isBlank()) {
                throw new IllegalArgumentException(field + " element " + i + " is blank");
            }
        }
    }

    /**
     * Refuses a list of the parameters that names one thing twice, as the command line refuses a
     * repeated option value: a species or lamp given twice enters every line twice, so that each
     * peak finds two equal candidates and none is matched.
     *
     * @param field  the list's name, for the message
     * @param values the list
     * @param key    what makes two entries the same (the parsed species, say)
     * @param <K>    the key's type
     * @throws IllegalArgumentException naming the repeated entry
     */
    static <K> void requireDistinct(String field, List<String> values, Function<String, K> key) {
        java.util.Map<K, String> seen = new java.util.HashMap<>();
        for (String value : values) {
            String earlier = seen.putIfAbsent(key.apply(value), value);
            if (earlier != null) {
                throw new IllegalArgumentException(field + " names '" + value.strip() + "' twice"
                        + (earlier.strip().equals(value.strip()) ? "" : " (also as '" + earlier.strip() + "')")
                        + "; give each once");
            }
        }
    }

    /**
     * @param dataFiles the user's files, first in precedence
     * @return the context the command line builds for {@code --data}: the discovered default,
     *         with the files added in order
     */
    static DataContext context(List<String> dataFiles) {
        DataContext context = DataContext.discoverDefault();
        for (String file : dataFiles) {
            context = context.withUserFile(Path.of(file));
        }
        return context;
    }

    /** A one-electron ion and its level model. */
    record Ion(Species species, HydrogenLikeModel model) {
    }

    /** The species of a parameter list, sorted as the command line sorts them. */
    record Atoms(List<Ion> ions, List<AlkaliAtom> alkalis, List<RitzLevels> levels) {
    }

    /**
     * @param data    the context
     * @param species species notations: one-electron ions, neutral alkali atoms, and species with
     *                a level list in the context (He I, Sr I), as the commands sort them
     * @param tierId  the ions' level model
     * @return their models, ions, alkali atoms and level lists apart, each in the given order
     * @throws IllegalArgumentException for a species that is none of these
     */
    static Atoms atoms(DataContext data, List<String> species, String tierId) {
        Tier tier = Tier.fromId(tierId);
        List<Ion> ions = new ArrayList<>();
        List<AlkaliAtom> alkalis = new ArrayList<>();
        List<RitzLevels> levels = new ArrayList<>();
        for (String text : species) {
            Species parsed = Species.parse(text.strip());
            if (parsed.isHydrogenLike()) {
                ions.add(new Ion(parsed, HydrogenLikeModel.of(data.nucleus(parsed), tier.forZ(parsed.z()))));
            } else if (parsed.charge() == 0 && data.alkaliSpecies().stream().anyMatch(s -> s.z() == parsed.z())) {
                alkalis.add(data.alkaliAtom(parsed));
            } else if (data.levelList(parsed).isPresent()) {
                levels.add(DataLines.levels(data, parsed));
            } else {
                throw new IllegalArgumentException(parsed.notation() + ": the engine's lines cover one-electron ions"
                        + " (H I, D I, He II, C VI, ...), the neutral alkali atoms "
                        + data.alkaliSpecies().stream().map(Species::notation).toList() + " and the species with a"
                        + " level list " + data.levelSpecies().stream().map(Species::notation).toList());
            }
        }
        return new Atoms(List.copyOf(ions), List.copyOf(alkalis), List.copyOf(levels));
    }

    /**
     * @param rows    a partition's rows
     * @param mapping one row to one row
     * @param <T>     row type
     * @return the mapped rows, lazily, one at a time
     */
    static <T> Iterator<T> map(Iterator<T> rows, Function<T, T> mapping) {
        return new Iterator<>() {
            @Override
            public boolean hasNext() {
                return rows.hasNext();
            }

            @Override
            public T next() {
                return mapping.apply(rows.next());
            }
        };
    }

    /**
     * Refuses a streaming table up front: the operations read a table's rows as one batch (and
     * count its ids), which Spark allows only at an action, with a message that does not name the
     * way out.
     *
     * @param table the input
     * @param role  the table's role, for the message
     * @throws IllegalArgumentException when the table is streaming
     */
    static void requireBatch(Dataset<Row> table, String role) {
        if (table.isStreaming()) {
            throw new IllegalArgumentException("the " + role + " table is a streaming Dataset (isStreaming()); the"
                    + " Ritzwerk operations take batch tables: run the operation on each micro-batch with"
                    + " writeStream().foreachBatch((batch, batchId) -> ...)");
        }
    }

    /** The column the id check adds: how many rows share this row's id, null when it is the only one. */
    static final String COPIES = "_ritzwerk_id_copies";
    private static final String KEY = "_ritzwerk_id";

    /**
     * The documented columns present in a table, in documented order (so that Spark reads no
     * other column), each under its documented name whatever its case in the table.
     */
    static Dataset<Row> documentedColumns(Dataset<Row> table, Fields fields) {
        String[] names = fields.present();
        String[] own = fields.presentColumns();
        Column[] columns = new Column[names.length];
        for (int k = 0; k < names.length; k++) {
            columns[k] = table.col(own[k]).as(names[k]);
        }
        return table.select(columns);
    }

    /**
     * @param selected a table's {@link #documentedColumns}, its id first
     * @return each id that more than one row holds (column {@code _ritzwerk_id}) with the number
     *         of those rows (column {@link #COPIES}), counted by Spark's own aggregation of the id
     *         column; a null id is not counted (the operations refuse each such row by itself);
     *         lazy
     */
    static Dataset<Row> repeatedIds(Dataset<Row> selected) {
        Column id = selected.col(selected.columns()[0]);
        return selected.where(id.isNotNull()).groupBy(id.as(KEY)).agg(count(lit(1)).as(COPIES))
                .where(col(COPIES).gt(1));
    }

    /**
     * The {@link #documentedColumns} and the id check as a column: {@link #COPIES} holding, for a
     * row whose id another row shares, the number of rows with that id, null otherwise. Spark
     * counts the ids ({@link #repeatedIds}) in jobs of their own before the plan's job and
     * broadcasts the repeated ones back, so this serves a table joined with another anyway (science
     * spectra with their calibrations); the operations' own path hands the repeated ids to its
     * tasks without a broadcast instead ({@link RepeatedIds}).
     */
    static Dataset<Row> checkedColumns(Dataset<Row> table, Fields fields) {
        Dataset<Row> selected = documentedColumns(table, fields);
        String[] names = selected.columns();
        Dataset<Row> repeated = repeatedIds(selected);
        Column[] out = new Column[names.length + 1];
        for (int k = 0; k < names.length; k++) {
            out[k] = selected.col(names[k]);
        }
        out[names.length] = repeated.col(COPIES);
        return selected.join(broadcast(repeated), selected.col(names[0]).equalTo(repeated.col(KEY)), "left_outer")
                .select(out);
    }

    /**
     * @param copies how many rows share the id (from {@link #COPIES})
     * @return the refusal of a row whose id is not unique
     */
    static SparkRowException repeatedId(String id, long copies, String table) {
        return new SparkRowException(SparkRowException.BAD_FIELD, id, "id", "the " + table + " table has " + copies
                + " rows with this id; each row needs its own id (the outputs are keyed by it)");
    }

    /**
     * What a partition's setup does with one row in Spark's form; made once per partition from
     * the broadcast parameters and the input's fields.
     *
     * @param <P> the parameter record
     */
    @FunctionalInterface
    interface InternalJob<P> extends Serializable {
        /**
         * @param parameters the broadcast parameters
         * @param fields     the input's fields
         * @return the partition's row mapping, with its setup made; its result may be
         *         overwritten by the next call (Spark copies each row out before it asks for the
         *         next, as with its own row iterators)
         */
        Function<InternalRow, InternalRow> setUp(P parameters, Fields fields);
    }

    /**
     * An operation on the fast path (see {@link Catalyst}): the documented columns with the id
     * check, read in Spark's form, one output row per input row made by the job's per-partition
     * setup, as a table of the output schema. Lazy: nothing runs until an action on the result.
     *
     * @param table      the input
     * @param expected   its documented schema
     * @param role       the table's role, for messages
     * @param parameters broadcast once
     * @param job        the per-partition setup and row mapping
     * @param output     the output schema
     * @param <P>        the parameter record
     * @return the output table
     * @throws SparkRowException when a column is missing or has another type
     */
    static <P> Dataset<Row> run(Dataset<Row> table, StructType expected, String role, P parameters,
            InternalJob<P> job, StructType output) {
        return run(table, expected, role, parameters, job, output, true);
    }

    /**
     * As {@link #run(Dataset, StructType, String, Object, InternalJob, StructType)}, with the id
     * check on or off ({@link RepeatedIds}; off, every id is taken as unique and none is counted).
     */
    static <P> Dataset<Row> run(Dataset<Row> table, StructType expected, String role, P parameters,
            InternalJob<P> job, StructType output, boolean checkIds) {
        requireBatch(table, role);
        Dataset<Row> selected = documentedColumns(table, Fields.of(table.schema(), expected, role));
        Fields fields = Fields.of(selected.schema(), expected, role);
        // Broadcast as Java-serialised bytes: a session configured with Kryo would otherwise
        // serialise the parameter record with Kryo, which cannot make a record.
        Broadcast<byte[]> shared = JavaSparkContext.fromSparkContext(table.sparkSession().sparkContext())
                .broadcast(serialise(parameters));
        return Catalyst.frame(table.sparkSession(),
                tasks(selected, checkIds, new InternalTask<>(shared, fields, role, job)), output);
    }

    /**
     * What the tasks of one partition share: the broadcast parameters, the input's fields, the
     * column of an id's copies (null where the id is unique), the table's role and the job.
     *
     * @param <P> the parameter record
     * @param <J> the job's per-partition setup
     */
    abstract static class PartitionTask<P, J> implements Serializable {
        private static final long serialVersionUID = 1L;
        private final Broadcast<byte[]> shared;
        final Fields fields;
        final String role;
        final J job;

        PartitionTask(Broadcast<byte[]> shared, Fields fields, String role, J job) {
            this.shared = shared;
            this.fields = fields;
            this.role = role;
            this.job = job;
        }

        /**
         * @param rows     the partition's rows
         * @param repeated the ids that more than one row holds, with their row counts
         * @return the output rows, lazily
         */
        abstract Iterator<InternalRow> call(Iterator<InternalRow> rows, java.util.Map<String, Long> repeated);

        /**
         * @return how many rows share the row's id, or null when it is unique (or null: the
         *         operation refuses a null id by itself)
         */
        final Long copies(InternalRow row, java.util.Map<String, Long> repeated) {
            return repeated.isEmpty() ? null : repeated.get(fields.idOrNull(row));
        }

        /** @return the parameter record, read from the broadcast (once per partition) */
        @SuppressWarnings("unchecked")
        final P parameters() {
            return (P) deserialise(shared.value());
        }
    }

    /**
     * One partition on the fast path: the job's setup once, then one output row per input row,
     * lazily; a row whose id is repeated is refused before its work.
     *
     * @param <P> the parameter record
     */
    static final class InternalTask<P> extends PartitionTask<P, InternalJob<P>> {
        private static final long serialVersionUID = 1L;

        InternalTask(Broadcast<byte[]> shared, Fields fields, String role, InternalJob<P> job) {
            super(shared, fields, role, job);
        }

        @Override
        Iterator<InternalRow> call(Iterator<InternalRow> rows, java.util.Map<String, Long> repeated) {
            if (!rows.hasNext()) {
                return rows;
            }
            Function<InternalRow, InternalRow> mapping = job.setUp(parameters(), fields);
            return map(rows, row -> {
                Long copies = copies(row, repeated);
                if (copies != null) {
                    throw repeatedId(fields.id(row), copies, role);
                }
                try {
                    return mapping.apply(row);
                } catch (SparkRowException e) {
                    throw e;
                } catch (IllegalArgumentException | ArithmeticException e) {
                    // An engine refusal the row's own checks did not foresee: name the row.
                    throw new SparkRowException(SparkRowException.BAD_ROW, fields.id(row), null, e.getMessage());
                }
            });
        }
    }

    /**
     * What a partition's setup does to check one row in Spark's form: the operation's own reading
     * and checks of the row, without its work; a bad row throws the {@link SparkRowException} the
     * operation throws for it.
     *
     * @param <P> the parameter record
     */
    @FunctionalInterface
    interface CheckJob<P> extends Serializable {
        /**
         * @param parameters the broadcast parameters
         * @param fields     the input's fields
         * @return the partition's check of one row, with its setup made
         */
        java.util.function.Consumer<InternalRow> setUp(P parameters, Fields fields);
    }

    /**
     * Every problem an operation would fail with, found in one pass: the same schema check, id
     * check and per-row checks as {@link #run}, each refusal caught and returned as a
     * {@link Schemas#PROBLEMS} row instead of failing the job. A schema problem (a missing column,
     * another type) gives a table of that one row, made on the driver; each row whose id other rows
     * share gives one row for it, and each row a field refusal (the first the operation meets, as
     * it stops there). Lazy like the operations.
     *
     * @param table      the input
     * @param expected   its documented schema
     * @param role       the table's role, for messages
     * @param parameters broadcast once
     * @param job        the per-partition setup and row check
     * @param checkIds   whether repeated ids are problems (as the operation's id check)
     * @return the problems, empty when the operation would not refuse a row
     * @throws IllegalArgumentException when the table is streaming
     */
    static <P> Dataset<Row> validate(Dataset<Row> table, StructType expected, String role, P parameters,
            CheckJob<P> job, boolean checkIds) {
        requireBatch(table, role);
        Fields fields;
        try {
            fields = Fields.of(table.schema(), expected, role);
        } catch (SparkRowException e) {
            return problemTable(table.sparkSession(), e);
        }
        Dataset<Row> selected = documentedColumns(table, fields);
        Fields read = Fields.of(selected.schema(), expected, role);
        Broadcast<byte[]> shared = JavaSparkContext.fromSparkContext(table.sparkSession().sparkContext())
                .broadcast(serialise(parameters));
        return Catalyst.frame(table.sparkSession(),
                tasks(selected, checkIds, new CheckTask<>(shared, read, role, job)), Schemas.PROBLEMS);
    }

    /**
     * @param selected the {@link #documentedColumns}
     * @param checkIds whether the tasks learn the repeated ids ({@link RepeatedIds}, in the same
     *                 job) or take every id as unique
     * @param task     each partition's work
     * @return the task's rows; lazy
     */
    private static RDD<InternalRow> tasks(Dataset<Row> selected, boolean checkIds, PartitionTask<?, ?> task) {
        RDD<InternalRow> rows = Catalyst.rows(selected);
        // A table whose plan makes its ids unique (grouped by them) cannot repeat one: no count.
        if (checkIds && !Catalyst.uniqueFirstColumn(selected)) {
            return RepeatedIds.checked(selected, rows, task::call);
        }
        return rows.toJavaRDD().mapPartitions(in -> task.call(in, java.util.Map.of())).rdd();
    }

    /** @return the problem row of a refusal, {@link Schemas#PROBLEMS} */
    static Row problemRow(SparkRowException e) {
        return RowFactory.create(e.rowId(), e.field(), e.code(), e.getMessage());
    }

    /** @return a {@link Schemas#PROBLEMS} table of one refusal made on the driver (a schema problem) */
    static Dataset<Row> problemTable(org.apache.spark.sql.SparkSession spark, SparkRowException e) {
        return spark.createDataFrame(List.of(problemRow(e)), Schemas.PROBLEMS);
    }

    /** @return the problem row of a refusal, {@link Schemas#PROBLEMS} in Spark's form */
    static InternalRow problem(SparkRowException e) {
        return Catalyst.row(Catalyst.utf8(e.rowId()), Catalyst.utf8(e.field()), Catalyst.utf8(e.code()),
                Catalyst.utf8(e.getMessage()));
    }

    /**
     * One partition of a validation: the job's check setup once, then each row's problems
     * (a repeated id, then the row's first refusal), lazily.
     *
     * @param <P> the parameter record
     */
    static final class CheckTask<P> extends PartitionTask<P, CheckJob<P>> {
        private static final long serialVersionUID = 1L;

        CheckTask(Broadcast<byte[]> shared, Fields fields, String role, CheckJob<P> job) {
            super(shared, fields, role, job);
        }

        @Override
        Iterator<InternalRow> call(Iterator<InternalRow> rows, java.util.Map<String, Long> repeated) {
            if (!rows.hasNext()) {
                return rows;
            }
            java.util.function.Consumer<InternalRow> check = job.setUp(parameters(), fields);
            java.util.ArrayDeque<InternalRow> found = new java.util.ArrayDeque<>(2);
            return new Iterator<>() {
                @Override
                public boolean hasNext() {
                    while (found.isEmpty() && rows.hasNext()) {
                        examine(rows.next());
                    }
                    return !found.isEmpty();
                }

                @Override
                public InternalRow next() {
                    if (!hasNext()) {
                        throw new java.util.NoSuchElementException();
                    }
                    return found.poll();
                }

                private void examine(InternalRow row) {
                    Long copies = copies(row, repeated);
                    if (copies != null) {
                        found.add(problem(repeatedId(fields.id(row), copies, role)));
                    }
                    try {
                        check.accept(row);
                    } catch (SparkRowException e) {
                        found.add(problem(e));
                    } catch (IllegalArgumentException | ArithmeticException e) {
                        // As the operation names a refusal its checks did not foresee.
                        found.add(problem(new SparkRowException(SparkRowException.BAD_ROW, fields.id(row), null,
                                e.getMessage())));
                    }
                }
            };
        }
    }

    /** The parameter record as Java-serialised bytes, for a broadcast any serializer can carry. */
    static byte[] serialise(Object parameters) {
        java.io.ByteArrayOutputStream bytes = new java.io.ByteArrayOutputStream();
        try (java.io.ObjectOutputStream out = new java.io.ObjectOutputStream(bytes)) {
            out.writeObject(parameters);
        } catch (java.io.IOException e) {
            throw new java.io.UncheckedIOException("cannot serialise the parameters", e);
        }
        return bytes.toByteArray();
    }

    /** @return the parameter record {@link #serialise} wrote */
    static Object deserialise(byte[] bytes) {
        try (java.io.ObjectInputStream in = new java.io.ObjectInputStream(new java.io.ByteArrayInputStream(bytes))) {
            return in.readObject();
        } catch (java.io.IOException | ClassNotFoundException e) {
            throw new IllegalStateException("cannot read the broadcast parameters: " + e, e);
        }
    }
}
