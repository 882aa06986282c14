package org.ritzwerk.data;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class ProvenanceTest {

    @Test
    void eachKindIsRenderedWithItsPrefixOnce() {
        assertEquals("computed by hydrogen-like qed tier", Provenance.computedBy("hydrogen-like qed tier").render());
        assertEquals("computed by the Coulomb approximation", Provenance.computedBy("computed by the Coulomb approximation")
                .render(), "a source that already says so is not prefixed twice");
        assertEquals("from memory: NIST ASD", Provenance.fromMemory("NIST ASD").render());
        assertEquals(new Provenance(Provenance.Kind.MEASURED, "bench 3, run 2026-11-30"),
                Provenance.measuredBy("bench 3, run 2026-11-30"));
        assertEquals("measured: bench 3, run 2026-11-30", Provenance.measuredBy("bench 3, run 2026-11-30").render());
        assertEquals("published: Wang et al. 2021", Provenance.published("Wang et al. 2021").render());
    }
}
