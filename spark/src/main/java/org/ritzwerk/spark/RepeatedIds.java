package org.ritzwerk.spark;

import java.io.Serializable;
import java.util.HashMap;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import org.apache.spark.Dependency;
import org.apache.spark.NarrowDependency;
import org.apache.spark.OneToOneDependency;
import org.apache.spark.Partition;
import org.apache.spark.TaskContext;
import org.apache.spark.api.java.JavaRDD;
import org.apache.spark.rdd.RDD;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.catalyst.InternalRow;
import scala.Tuple2;
import scala.jdk.javaapi.CollectionConverters;
import scala.reflect.ClassTag;
import scala.reflect.ClassTag$;

/**
 * The id check of the operations without a broadcast: the ids that more than one row holds are
 * counted, shuffled into a single partition, and every task of the operation reads that partition
 * (usually empty) before its rows. Where the table is read as it is (a source or a cache), Spark's
 * own aggregation counts its id column, which Spark runs as one small job when the action starts;
 * where the table's plan shuffles, the ids are read from the same rows and counted inside the
 * operation's own job, so that the shuffle runs once. Nothing is collected on the driver and
 * nothing runs before the action.
 *
 * <p>Why not a join: a broadcast join of the repeated ids made Spark run the count and the
 * broadcast as two jobs of their own, planned on the driver one after the other before the
 * operation's job. Measured in pairs of passes with and without the check
 * ({@code spark/benchmark id-check-cost}): 228 ms against 116 ms here for 10,000 scenes on two
 * cores, 322 ms against 228 ms for 200,000 peak lists on one. Counting Java objects by a shuffle
 * of every id instead cost 750 ms for those lists, which is why the source case uses Spark's
 * aggregation.
 */
final class RepeatedIds {

    private static final ClassTag<InternalRow> ROWS = ClassTag$.MODULE$.apply(InternalRow.class);

    private RepeatedIds() {
    }

    /**
     * What a task does with its partition's rows, knowing the ids that other rows share.
     */
    @FunctionalInterface
    interface Task extends Serializable {
        /**
         * @param rows     the partition's rows
         * @param repeated each id that more than one row of the table holds, with the number of
         *                 those rows; empty when every id is unique
         * @return the output rows, lazily
         */
        Iterator<InternalRow> call(Iterator<InternalRow> rows, Map<String, Long> repeated);
    }

    /**
     * @param selected the table's documented columns, its id first
     * @param rows     {@code selected}'s rows in Spark's form
     * @param task     what each partition does
     * @return the task's rows, one partition per partition of {@code rows}; lazy
     */
    static RDD<InternalRow> checked(Dataset<Row> selected, RDD<InternalRow> rows, Task task) {
        JavaRDD<Tuple2<String, Long>> repeated;
        if (Catalyst.exchanges(selected)) {
            // The same rows where the table's plan shuffles, so that the shuffle runs once for both (a
            // second plan of the id column would run it again); counted by a shuffle of the ids.
            int reducers = Math.max(1, rows.context().defaultParallelism());
            repeated = rows.toJavaRDD().filter(row -> !row.isNullAt(0))
                    .mapToPair(row -> new Tuple2<>(row.getUTF8String(0).toString(), 1L))
                    .reduceByKey(Long::sum, reducers).filter(pair -> pair._2() > 1)
                    .map(pair -> new Tuple2<>(pair._1(), pair._2()));
        } else {
            // The id column alone where the table is read from a source or a cache (a columnar source
            // or cache then reads that one column), counted by Spark's own aggregation, whose rows
            // are far cheaper to shuffle than Java objects (see the class comment).
            repeated = Catalyst.rows(Setups.repeatedIds(selected)).toJavaRDD()
                    .map(row -> new Tuple2<>(row.getUTF8String(0).toString(), row.getLong(1)));
        }
        // The repeated ids, shuffled into one partition that every task reads.
        return new WithRepeated(rows, repeated.coalesce(1, true).rdd(), task);
    }

    /** A partition of the rows beside the one partition of the repeated ids. */
    private record Pair(int index, Partition rows, Partition repeated) implements Partition {
        private static final long serialVersionUID = 1L;
    }

    /** The rows, each partition read after the repeated ids: a narrow dependency on both. */
    private static final class WithRepeated extends RDD<InternalRow> {
        private static final long serialVersionUID = 1L;
        private final RDD<InternalRow> rows;
        private final RDD<Tuple2<String, Long>> repeated;
        private final Task task;

        WithRepeated(RDD<InternalRow> rows, RDD<Tuple2<String, Long>> repeated, Task task) {
            super(rows.context(), CollectionConverters.asScala(List.<Dependency<?>>of(new OneToOneDependency<>(rows),
                    new AllToFirst<>(repeated))).toSeq(), ROWS);
            this.rows = rows;
            this.repeated = repeated;
            this.task = task;
        }

        @Override
        public Partition[] getPartitions() {
            Partition[] own = rows.partitions();
            Partition first = repeated.partitions()[0];
            Partition[] out = new Partition[own.length];
            for (int k = 0; k < own.length; k++) {
                out[k] = new Pair(k, own[k], first);
            }
            return out;
        }

        @Override
        public scala.collection.immutable.Seq<String> getPreferredLocations(Partition split) {
            return rows.preferredLocations(((Pair) split).rows());
        }

        @Override
        public scala.collection.Iterator<InternalRow> compute(Partition split, TaskContext context) {
            Pair pair = (Pair) split;
            Map<String, Long> copies = new HashMap<>();
            scala.collection.Iterator<Tuple2<String, Long>> ids = repeated.iterator(pair.repeated(), context);
            while (ids.hasNext()) {
                Tuple2<String, Long> id = ids.next();
                copies.put(id._1(), id._2());
            }
            Iterator<InternalRow> in = CollectionConverters.asJava(rows.iterator(pair.rows(), context));
            return CollectionConverters.asScala(task.call(in, copies));
        }
    }

    /** Every partition of the child reads the parent's first (and only) partition. */
    private static final class AllToFirst<T> extends NarrowDependency<T> {
        private static final long serialVersionUID = 1L;

        AllToFirst(RDD<T> parent) {
            super(parent);
        }

        @Override
        public scala.collection.immutable.Seq<Object> getParents(int partitionId) {
            return CollectionConverters.asScala(List.<Object>of(0)).toSeq();
        }
    }
}
