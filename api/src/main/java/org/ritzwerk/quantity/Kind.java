package org.ritzwerk.quantity;

/** The kinds of quantity Ritzwerk types, each with its canonical SI unit. */
public enum Kind {
    /** A wavelength, canonical unit metre; always stated with its medium. */
    WAVELENGTH("wavelength"),
    /** A wavenumber (inverse vacuum wavelength, or a level energy over hc), canonical unit m^-1. */
    WAVENUMBER("wavenumber"),
    /** A frequency, canonical unit hertz. */
    FREQUENCY("frequency"),
    /** An energy (photon, level or thermal), canonical unit joule. */
    ENERGY("energy"),
    /** A thermodynamic temperature, canonical unit kelvin. */
    TEMPERATURE("temperature");

    private final String noun;

    Kind(String noun) {
        this.noun = noun;
    }

    /** @return the kind as a lower-case English noun, for messages */
    public String noun() {
        return noun;
    }
}
