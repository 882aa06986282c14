package org.ritzwerk.spark;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.apache.spark.Dependency;
import org.apache.spark.OneToOneDependency;
import org.apache.spark.Partition;
import org.apache.spark.TaskContext;
import org.apache.spark.rdd.RDD;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.SparkSession;
import org.apache.spark.sql.catalyst.InternalRow;
import org.apache.spark.sql.catalyst.expressions.Attribute;
import org.apache.spark.sql.catalyst.expressions.ExpressionSet;
import org.apache.spark.sql.catalyst.expressions.GenericInternalRow;
import org.apache.spark.sql.catalyst.expressions.UnsafeArrayData;
import org.apache.spark.sql.catalyst.expressions.codegen.UnsafeRowWriter;
import org.apache.spark.sql.catalyst.plans.logical.LogicalPlan;
import org.apache.spark.sql.catalyst.util.ArrayData;
import org.apache.spark.sql.catalyst.util.GenericArrayData;
import org.apache.spark.sql.types.StructType;
import org.apache.spark.unsafe.types.UTF8String;
import org.apache.spark.sql.execution.exchange.Exchange;
import scala.jdk.javaapi.CollectionConverters;
import scala.jdk.javaapi.FunctionConverters;
import scala.reflect.ClassTag;
import scala.reflect.ClassTag$;

/**
 * The operations' fast path: tables read and written in Spark's own row form
 * ({@link InternalRow}) instead of generic {@link Row}s.
 *
 * <p>Why (profiled, see the module's benchmark): a generic row turns every array of doubles into a
 * sequence of boxed values on the way in, and on the way out Spark's encoder for generic rows
 * compiles the documented output schemas (an array of 50 nested peak records per spectrum) into
 * one generated method too large for the JIT compiler, which then runs interpreted. Here arrays of
 * doubles are copied in one piece ({@link ArrayData#toDoubleArray()},
 * {@link UnsafeArrayData#fromPrimitiveArray(double[])}), and output rows are built directly in
 * the form Spark stores: identification and synthesis write them with Spark's
 * {@link UnsafeRowWriter} into its binary row form (then Spark's conversion of the operation's
 * rows copies each nested array in one piece instead of element by element, and no value is
 * boxed; a profile of identification in local[1] had row building and that conversion at about
 * 23 % of the time, 12 % after), calibration as generic rows of these values.
 *
 * <p>This uses two members that Spark marks as internal to its SQL package (a Dataset's query
 * execution and the session's {@code internalCreateDataFrame}); they are the ones Spark's own
 * {@code createDataFrame} builds on, and present in the classic (JVM) session of Spark 4.
 */
final class Catalyst {

    private Catalyst() {
    }

    /**
     * @param table a table of a classic (not Spark Connect) session
     * @return the table's rows in Spark's form, planned only when Spark first needs them (so the
     *         operation stays lazy: planning a table with a shuffle runs that shuffle); Spark may
     *         reuse a row object between calls of the iterator's {@code next}, so read each row
     *         before the next
     */
    static RDD<InternalRow> rows(Dataset<Row> table) {
        return new Planned(classic(table));
    }

    /**
     * A table's rows, planned at first need on the driver (the partitions, dependencies or
     * locations asked for), then read partition by partition on the executors.
     */
    private static final class Planned extends RDD<InternalRow> {
        private static final long serialVersionUID = 1L;
        private static final ClassTag<InternalRow> ROWS = ClassTag$.MODULE$.apply(InternalRow.class);
        /** The table; only on the driver. */
        private final transient org.apache.spark.sql.classic.Dataset<Row> table;
        /** The planned rows, made on the driver before any task is sent. */
        private RDD<InternalRow> planned;

        Planned(org.apache.spark.sql.classic.Dataset<Row> table) {
            super(table.sparkSession().sparkContext(), CollectionConverters.asScala(List.<Dependency<?>>of()).toSeq(),
                    ROWS);
            this.table = table;
        }

        private synchronized RDD<InternalRow> planned() {
            if (planned == null) {
                planned = table.queryExecution().toRdd();
            }
            return planned;
        }

        @Override
        public Partition[] getPartitions() {
            return planned().partitions();
        }

        @Override
        public scala.collection.immutable.Seq<Dependency<?>> getDependencies() {
            return CollectionConverters.asScala(List.<Dependency<?>>of(new OneToOneDependency<>(planned()))).toSeq();
        }

        @Override
        public scala.collection.immutable.Seq<String> getPreferredLocations(Partition split) {
            return planned().preferredLocations(split);
        }

        @Override
        public scala.collection.Iterator<InternalRow> compute(Partition split, TaskContext context) {
            return planned.iterator(split, context);
        }
    }

    /**
     * @param table a table of a classic session
     * @return whether Spark's physical plan of the table holds an exchange (a shuffle or a
     *         broadcast; a cached table is a leaf, whatever made it), found by planning the table
     *         on the driver without running anything
     */
    static boolean exchanges(Dataset<Row> table) {
        return classic(table).queryExecution().sparkPlan()
                .find(FunctionConverters.asScalaFromFunction(plan -> plan instanceof Exchange)).isDefined();
    }

    /**
     * @param table a table of a classic session
     * @return whether Spark's optimizer knows the table's first column to be unique: its optimized
     *         plan has a set of distinct keys made of that column alone (an aggregate grouped by it, as
     *         {@code groupBy("id")} or {@link SurveyIdentification#peakLists} make; a
     *         {@code dropDuplicates("id")}; a filter, sort or limit of such a table; a join of it onto a
     *         table Spark knows unique on the join keys). Found on the driver without running anything;
     *         false wherever Spark cannot tell (a source or a cache read as it is, a union, other joins,
     *         or {@code spark.sql.optimizer.propagateDistinctKeys.enabled} off)
     */
    static boolean uniqueFirstColumn(Dataset<Row> table) {
        LogicalPlan plan = classic(table).queryExecution().optimizedPlan();
        Attribute first = plan.output().head();
        scala.collection.Iterator<ExpressionSet> keys = plan.distinctKeys().iterator();
        while (keys.hasNext()) {
            if (keys.next().forall(FunctionConverters.asScalaFromFunction(key -> key.semanticEquals(first)))) {
                return true;
            }
        }
        return false;
    }

    private static org.apache.spark.sql.classic.Dataset<Row> classic(Dataset<Row> table) {
        if (!(table instanceof org.apache.spark.sql.classic.Dataset<Row> classic)) {
            throw new IllegalArgumentException("the Ritzwerk operations run in a classic Spark session (a JVM driver),"
                    + " not over Spark Connect; this table is a " + table.getClass().getName());
        }
        return classic;
    }

    /**
     * @param spark  the session
     * @param rows   rows in Spark's form, matching the schema
     * @param schema the table's schema
     * @return the table
     */
    static Dataset<Row> frame(SparkSession spark, RDD<InternalRow> rows, StructType schema) {
        if (!(spark instanceof org.apache.spark.sql.classic.SparkSession classic)) {
            throw new IllegalArgumentException("the Ritzwerk operations run in a classic Spark session (a JVM driver),"
                    + " not over Spark Connect");
        }
        return classic.internalCreateDataFrame(rows, schema, false);
    }

    /** @return a row of these values in Spark's form (strings as {@link UTF8String}, arrays as {@link ArrayData}) */
    static InternalRow row(Object... values) {
        return new GenericInternalRow(values);
    }

    /** @return the doubles as one array of Spark's form, or null */
    static ArrayData doubles(double[] values) {
        return values == null ? null : UnsafeArrayData.fromPrimitiveArray(values);
    }

    /** @return the elements (rows, strings in Spark's form) as an array of Spark's form */
    static ArrayData array(Object[] elements) {
        return new GenericArrayData(elements);
    }

    /** @return the string in Spark's form, or null */
    static UTF8String utf8(String value) {
        return value == null ? null : UTF8String.fromString(value);
    }

    /** Writes the string into the row, or null. */
    static void string(UnsafeRowWriter writer, int field, UTF8String value) {
        if (value == null) {
            writer.setNullAt(field);
        } else {
            writer.write(field, value);
        }
    }

    /** Writes the value into the row, or null for NaN (undefined doubles are null in the output tables). */
    static void orNull(UnsafeRowWriter writer, int field, double value) {
        if (Double.isNaN(value)) {
            writer.setNullAt(field);
        } else {
            writer.write(field, value);
        }
    }

    /** @return the value, or null for NaN (undefined doubles are null in the output tables) */
    static Double orNull(double value) {
        return Double.isNaN(value) ? null : value;
    }

    /**
     * Strings that recur from row to row (species, line labels, statuses) in Spark's form, made
     * once per partition. Not thread-safe (one task).
     */
    static final class Strings {
        private final Map<String, UTF8String> made = new HashMap<>();

        /** @return the string in Spark's form, or null */
        UTF8String of(String value) {
            if (value == null) {
                return null;
            }
            UTF8String utf8 = made.get(value);
            if (utf8 == null) {
                if (made.size() > 100_000) {
                    made.clear(); // a bound on memory for unusually many distinct labels
                }
                utf8 = UTF8String.fromString(value);
                made.put(value, utf8);
            }
            return utf8;
        }
    }
}
