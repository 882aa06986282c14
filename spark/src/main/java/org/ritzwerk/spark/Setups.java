package org.ritzwerk.spark;

import java.io.Serializable;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.function.Function;
import org.apache.spark.api.java.function.MapPartitionsFunction;
import org.apache.spark.broadcast.Broadcast;
import org.apache.spark.sql.Row;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.refdata.DataContext;

/** What the operations' per-partition setups share: the data context and the species' models. */
final class Setups {

    private Setups() {
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
    record Atoms(List<Ion> ions, List<AlkaliAtom> alkalis) {
    }

    /**
     * @param data    the context
     * @param species species notations: one-electron ions and neutral alkali atoms
     * @param tierId  the ions' level model
     * @return their models, ions and alkali atoms apart, each in the given order
     * @throws IllegalArgumentException for a species that is neither
     */
    static Atoms atoms(DataContext data, List<String> species, String tierId) {
        Tier tier = Tier.fromId(tierId);
        List<Ion> ions = new ArrayList<>();
        List<AlkaliAtom> alkalis = new ArrayList<>();
        for (String text : species) {
            Species parsed = Species.parse(text.strip());
            if (parsed.isHydrogenLike()) {
                ions.add(new Ion(parsed, HydrogenLikeModel.of(data.nucleus(parsed), tier)));
            } else if (parsed.charge() == 0 && data.alkaliSpecies().stream().anyMatch(s -> s.z() == parsed.z())) {
                alkalis.add(data.alkaliAtom(parsed));
            } else {
                throw new IllegalArgumentException(parsed.notation() + ": the engine's lines cover one-electron ions"
                        + " (H I, D I, He II, C VI, ...) and the neutral alkali atoms "
                        + data.alkaliSpecies().stream().map(Species::notation).toList());
            }
        }
        return new Atoms(List.copyOf(ions), List.copyOf(alkalis));
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
     * What a partition's setup does with one row; made once per partition from the broadcast
     * parameters and the input's fields.
     *
     * @param <P> the parameter record
     */
    @FunctionalInterface
    interface RowJob<P> extends Serializable {
        /**
         * @param parameters the broadcast parameters
         * @param fields     the input's fields
         * @return the partition's row mapping, with its setup made
         */
        Function<Row, Row> setUp(P parameters, Fields fields);
    }

    /**
     * One partition: the job's setup once (from the parameters broadcast once per job), then one
     * output row per input row, lazily.
     *
     * @param <P> the parameter record
     */
    static final class PartitionTask<P> implements MapPartitionsFunction<Row, Row> {
        private static final long serialVersionUID = 1L;
        private final Broadcast<P> shared;
        private final Fields fields;
        private final RowJob<P> job;

        PartitionTask(Broadcast<P> shared, Fields fields, RowJob<P> job) {
            this.shared = shared;
            this.fields = fields;
            this.job = job;
        }

        @Override
        public Iterator<Row> call(Iterator<Row> rows) {
            if (!rows.hasNext()) {
                return rows;
            }
            return map(rows, job.setUp(shared.value(), fields));
        }
    }

    /** @return the value, or null for NaN (undefined doubles are null in the output tables) */
    static Double orNull(double value) {
        return Double.isNaN(value) ? null : value;
    }
}
