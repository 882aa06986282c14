package org.ritzwerk.spark;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.SplittableRandom;
import org.apache.spark.sql.catalyst.expressions.codegen.UnsafeRowWriter;
import org.apache.spark.unsafe.types.UTF8String;
import org.junit.jupiter.api.Test;

/** The row-form helpers, against Spark's own writer methods (no session needed). */
class CatalystTest {

    /**
     * Nulling a range of fields in one step writes the same bytes as Spark's {@code setNullAt} on each
     * field: for random rows of 1 to 63 fields, with values, strings and nulls written before, every
     * range, and the row written on over dirty buffer bytes (a reused writer), as the operations do.
     */
    @Test
    void aRangeOfNullsIsWhatSparksSetNullAtWritesFieldByField() {
        SplittableRandom random = new SplittableRandom(7);
        for (int trial = 0; trial < 300; trial++) {
            int fields = 1 + random.nextInt(63);
            int from = random.nextInt(fields);
            int to = from + 1 + random.nextInt(fields - from);
            long seed = random.nextLong();
            UnsafeRowWriter byField = new UnsafeRowWriter(fields, 64);
            UnsafeRowWriter byRange = new UnsafeRowWriter(fields, 64);
            for (UnsafeRowWriter writer : new UnsafeRowWriter[] {byField, byRange}) {
                // a first row fills the buffer with other bytes, then the row compared is written over it
                for (int pass = 0; pass < 2; pass++) {
                    SplittableRandom values = new SplittableRandom(seed + pass);
                    writer.reset();
                    writer.zeroOutNullBytes();
                    for (int f = 0; f < fields; f++) {
                        int kind = values.nextInt(3);
                        if (kind == 0) {
                            writer.write(f, values.nextDouble());
                        } else if (kind == 1) {
                            writer.write(f, UTF8String.fromString("v" + values.nextInt(1000)));
                        } else {
                            writer.setNullAt(f);
                        }
                    }
                }
            }
            for (int f = from; f < to; f++) {
                byField.setNullAt(f);
            }
            Catalyst.setNullAt(byRange, fields, from, to);
            assertArrayEquals(byField.getRow().getBytes(), byRange.getRow().getBytes(),
                    fields + " fields, null from " + from + " to " + to);
        }
    }

    @Test
    void aRangeOutsideTheRowIsRefused() {
        UnsafeRowWriter writer = new UnsafeRowWriter(13, 64);
        writer.reset();
        writer.zeroOutNullBytes();
        assertThrows(IllegalArgumentException.class, () -> Catalyst.setNullAt(writer, 13, 8, 14));
        assertThrows(IllegalArgumentException.class, () -> Catalyst.setNullAt(writer, 13, 5, 5));
        assertThrows(IllegalArgumentException.class, () -> Catalyst.setNullAt(writer, 64, 0, 1));
    }
}
