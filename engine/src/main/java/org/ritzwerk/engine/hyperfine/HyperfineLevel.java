package org.ritzwerk.engine.hyperfine;

import org.ritzwerk.engine.hydrogenic.Notation;

/**
 * One hyperfine level F of a fine-structure level, at zero field. Immutable and thread-safe.
 *
 * @param twoF       2 F
 * @param shiftHertz its energy / h relative to the fine-structure level's centroid (the
 *                   (2F+1)-weighted mean of its F levels, which the Casimir formula puts at 0), Hz
 */
public record HyperfineLevel(int twoF, double shiftHertz) {

    /** @return F as a number (e.g. 1.5) */
    public double f() {
        return twoF / 2.0;
    }

    /** @return F as text: {@code 2} or {@code 5/2} */
    public String fLabel() {
        return Notation.half(twoF);
    }
}
